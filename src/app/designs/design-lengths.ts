import type { AbstractControl, ValidationErrors } from '@angular/forms';
import { BedRegion, DesignBody, DomainError, Length, LengthUnit, MATTRESS_PRESETS, MattressPreset, Size, formatInches, formatMetric, quiltSizeForBed, tryParseLength } from '@keepstitch/shared';

// The design form's lengths as a maker types and reads them, its validators, and the bed presets' sizes.

export const unitOf = (units: 'imperial' | 'metric'): LengthUnit => (units === 'imperial' ? 'in' : 'cm');

/** A stored length shown for editing in the maker's unit ("12", "30.5"). */
export function lengthForEditing(mm: string | undefined | null, units: 'imperial' | 'metric'): string {
  if (!mm) return '';
  return Length.millimetres(mm).to(unitOf(units)).toDecimalPlaces(4).toString();
}

/**
 * A worked-out length as a ruler or tape reads it, for a field that only shows it:
 * "77 1/8" (nearest 1/8 in) rather than "77.1496", or "196" cm to the millimetre.
 */
export function lengthAsMeasured(length: Length, units: 'imperial' | 'metric'): string {
  return units === 'imperial' ? formatInches(length, 'nearest', '') : formatMetric(length, 'cm').replace(/ cm$/, '');
}

/** Typed text to exact millimetres, or null when it cannot be read. */
export function millimetresOf(text: string, units: 'imperial' | 'metric'): string | null {
  if (text.trim() === '') return null;
  const parsed = tryParseLength(text, unitOf(units));
  return parsed.ok && parsed.length.mm.gt(0) ? parsed.length.mm.toString() : null;
}

export function lengthValidator(form: () => 'imperial' | 'metric', required = true) {
  return (c: AbstractControl<string>): ValidationErrors | null => {
    const text = c.value ?? '';
    if (text.trim() === '') return required ? { required: true } : null;
    const parsed = tryParseLength(text, unitOf(form()));
    return parsed.ok ? null : { length: parsed.error.message };
  };
}

export function lengthsValidator(form: () => 'imperial' | 'metric') {
  return (c: AbstractControl<string>): ValidationErrors | null => {
    const parts = (c.value ?? '').split(',').map((s) => s.trim()).filter(Boolean);
    for (const p of parts) {
      const parsed = tryParseLength(p, unitOf(form()));
      if (!parsed.ok) return { length: `"${p}": ${parsed.error.message}` };
    }
    return null;
  };
}

/** The same design but for its fabric choices (groups and assignments), which the fabric board changes. */
export const sameButFabrics = (a: DesignBody, b: DesignBody) => JSON.stringify({ ...a, groups: [], assignments: [] }) === JSON.stringify({ ...b, groups: [], assignments: [] });

/** The bed presets by region, for the size menu. */
export const PRESET_GROUPS: readonly { region: BedRegion; presets: readonly MattressPreset[] }[] = (['UK', 'EU', 'US'] as const).map((region) => ({
  region,
  presets: MATTRESS_PRESETS.filter((p) => p.region === region),
}));

export const presetOf = (id: string | null): MattressPreset | undefined => (id ? MATTRESS_PRESETS.find((p) => p.id === id) : undefined);

/** A drop or tuck as typed (0 allowed), or null when it cannot be read. */
export function lengthOrZero(text: string, units: 'imperial' | 'metric'): Length | null {
  if (text.trim() === '') return Length.zero;
  const parsed = tryParseLength(text, unitOf(units), { allowZero: true });
  return parsed.ok ? parsed.length : null;
}

/** The quilt size for a bed preset, drop and pillow tuck, through the shared bed maths. */
export function bedQuiltSize(presetId: string, drop: Length, pillowTuck: Length): Size {
  const preset = presetOf(presetId);
  if (!preset) throw new DomainError('unknown-preset', `There is no bed size "${presetId}".`, 'bed');
  return quiltSizeForBed({ mattress: preset.size, drop, pillowTuck }).size;
}

/** Whether a bed with this drop and tuck is the stored width; false when the bed maths refuses them. */
export function bedGives(presetId: string, drop: Length, tuck: Length, widthMm: string): boolean {
  try {
    return bedQuiltSize(presetId, drop, tuck).width.mm.eq(widthMm);
  } catch {
    return false;
  }
}
