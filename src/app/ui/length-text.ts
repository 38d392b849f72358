import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { Length, LengthUnit, formatFinishedSize, formatLength, tryParseLength } from '@keepstitch/shared';

/** The units a maker may type a length in, with their labels. */
export const LENGTH_UNITS: readonly { value: LengthUnit; label: string }[] = [
  { value: 'in', label: 'in' },
  { value: 'cm', label: 'cm' },
  { value: 'mm', label: 'mm' },
  { value: 'm', label: 'm' },
  { value: 'yd', label: 'yd' },
];

export type LengthReading =
  | { ok: true; imperial: string; metric: string }
  | { ok: false; message: string };

/**
 * What a typed length reads as, in both unit systems ("19 1/2 in" and "49.5 cm"),
 * with the shared parser's own message when it cannot be read. Null when empty.
 */
export function readLength(text: string, unit: LengthUnit, options: { allowZero?: boolean } = {}): LengthReading | null {
  if (text.trim() === '') return null;
  const parsed = tryParseLength(text, unit, { allowZero: options.allowZero });
  if (!parsed.ok) return { ok: false, message: parsed.error.message };
  return { ok: true, ...bothSystems(parsed.length) };
}

export function bothSystems(length: Length): { imperial: string; metric: string } {
  return { imperial: formatLength(length, 'imperial'), metric: formatLength(length, 'metric') };
}

/** "19 1/2 in (49.5 cm)" from the server's exact millimetres; empty when there is none. */
export function showMillimetres(mm: string | null | undefined): string {
  if (mm === null || mm === undefined || mm === '') return '';
  const both = bothSystems(Length.millimetres(mm));
  return `${both.imperial} (${both.metric})`;
}

/**
 * A validator for a length typed as text, read in the unit `unit()` returns.
 * Puts the parser's message on the `length` error. Empty passes unless `required`;
 * zero passes only with `allowZero` (a distance from an edge).
 */
export function lengthText(unit: () => LengthUnit, required = false, options: { allowZero?: boolean } = {}): ValidatorFn {
  return (control: AbstractControl<string | null>): ValidationErrors | null => {
    const text = control.value ?? '';
    if (text.trim() === '') return required ? { required: true } : null;
    const reading = readLength(text, unit(), options);
    return reading && !reading.ok ? { length: reading.message } : null;
  };
}

/** "19 1/2 in · 49.5 cm" for a readable length; null when empty or unreadable. */
export function readingText(text: string, unit: LengthUnit, options: { allowZero?: boolean } = {}): string | null {
  const reading = readLength(text, unit, options);
  return reading && reading.ok ? `${reading.imperial} · ${reading.metric}` : null;
}

/**
 * The unit stored sizes read back in for editing: inches when every length
 * falls on a 1/8 in mark (as typed fractions do), otherwise centimetres.
 */
export function unitForMillimetres(mms: readonly (string | null | undefined)[]): 'in' | 'cm' {
  const eighth = Length.inches('0.125');
  return mms.every((mm) => !mm || Length.millimetres(mm).ratio(eighth).isInteger()) ? 'in' : 'cm';
}

/** A stored length written back as a maker types it in `unit`, without the unit: "60 1/2" or "153.7". */
export function typedLength(mm: string | null | undefined, unit: 'in' | 'cm'): string {
  if (mm === null || mm === undefined || mm === '') return '';
  const shown = formatFinishedSize(Length.millimetres(mm), unit === 'in' ? 'imperial' : 'metric', 'cm');
  return shown.replace(/ (in|cm)$/, '');
}
