// Showing lengths: inches as whole + fraction to the nearest 1/8 in, metric to
// 1 mm (0.1 cm), fabric quantities in yards (to 1/8 yd) or metres (to 1 cm).
// Each formatter rounds first with a named rounding step, then writes text.

import { Length, Size } from './measure';
import { EIGHTH_INCH, MILLIMETRE, RoundingMode, roundToStep } from './rounding';

export type UnitSystem = 'imperial' | 'metric';
export type MetricUnit = 'mm' | 'cm' | 'm';

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** "7 1/2", "7/8", "12" from a count of eighths. */
function eighthsText(eighths: number): string {
  const whole = Math.floor(eighths / 8);
  const rest = eighths % 8;
  if (rest === 0) return `${whole}`;
  const divisor = gcd(rest, 8);
  const fraction = `${rest / divisor}/${8 / divisor}`;
  return whole === 0 ? fraction : `${whole} ${fraction}`;
}

function signed(length: Length, body: (positive: Length) => string): string {
  return length.isNegative() ? `-${body(length.negated())}` : body(length);
}

/**
 * Inches to the 1/8 in mark, e.g. "6 1/2 in". `mode` picks the rounding:
 * "nearest" for finished sizes (default), "up" for cut sizes.
 */
export function formatInches(length: Length, mode: RoundingMode = 'nearest', unitLabel = ' in'): string {
  return signed(length, (positive) => {
    const rounded = roundToStep(positive, EIGHTH_INCH, mode);
    const eighths = rounded.ratio(EIGHTH_INCH).toNumber();
    return `${eighthsText(eighths)}${unitLabel}`;
  });
}

/** Metric to the millimetre: "165 mm", "16.5 cm" or "1.651 m". */
export function formatMetric(length: Length, unit: MetricUnit = 'cm', mode: RoundingMode = 'nearest'): string {
  return signed(length, (positive) => {
    const rounded = roundToStep(positive, MILLIMETRE, mode);
    return `${rounded.to(unit).toString()} ${unit}`;
  });
}

export interface FormatOptions {
  /** Rounding step mode; default "nearest" (finished sizes). */
  mode?: RoundingMode;
  /** Metric unit to show; default "cm". */
  metricUnit?: MetricUnit;
}

/** A length in the maker's chosen units. */
export function formatLength(length: Length, system: UnitSystem, options: FormatOptions = {}): string {
  const mode = options.mode ?? 'nearest';
  return system === 'imperial' ? formatInches(length, mode) : formatMetric(length, options.metricUnit ?? 'cm', mode);
}

/** A cut size: always rounded UP so a piece is never short. */
export function formatCutSize(length: Length, system: UnitSystem = 'imperial', metricUnit: MetricUnit = 'cm'): string {
  return formatLength(length, system, { mode: 'up', metricUnit });
}

/** A finished size: rounded to the nearest mark. */
export function formatFinishedSize(length: Length, system: UnitSystem = 'imperial', metricUnit: MetricUnit = 'cm'): string {
  return formatLength(length, system, { mode: 'nearest', metricUnit });
}

/** "6 1/2 x 6 1/2 in" or "16.5 x 16.5 cm". */
export function formatSize(size: Size, system: UnitSystem = 'imperial', options: FormatOptions = {}): string {
  const mode = options.mode ?? 'nearest';
  if (system === 'imperial') {
    return `${formatInches(size.width, mode, '')} x ${formatInches(size.height, mode, ' in')}`;
  }
  const unit = options.metricUnit ?? 'cm';
  const w = formatMetric(size.width, unit, mode).replace(` ${unit}`, '');
  return `${w} x ${formatMetric(size.height, unit, mode)}`;
}

/**
 * A fabric quantity: yards to 1/8 yd ("1 3/8 yd") or metres to 1 cm ("1.2 m").
 * Quantities to buy are rounded to the shop increment before this.
 */
export function formatFabricLength(length: Length, unit: 'yd' | 'm', mode: RoundingMode = 'nearest'): string {
  return signed(length, (positive) => {
    if (unit === 'yd') {
      const eighthYard = Length.yards('0.125');
      const rounded = roundToStep(positive, eighthYard, mode);
      return `${eighthsText(rounded.ratio(eighthYard).toNumber())} yd`;
    }
    const rounded = roundToStep(positive, Length.centimetres(1), mode);
    return `${rounded.to('m').toString()} m`;
  });
}
