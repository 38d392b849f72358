// Length: an exact measure held in millimetres as a decimal.js value.
// 1 in = 25.4 mm and 1 yd = 0.9144 m exactly (international yard and pound
// agreement of 1959), so every inch value a ruler can show (eighths,
// sixteenths) is held without rounding.

import Decimal from 'decimal.js';
import { MeasureError } from './errors';

/** Units a length can be given in or converted to. */
export type LengthUnit = 'mm' | 'cm' | 'm' | 'in' | 'yd';

/** Millimetres in one of each unit (exact). */
export const MILLIMETRES_PER_UNIT: Readonly<Record<LengthUnit, Decimal>> = Object.freeze({
  mm: new Decimal(1),
  cm: new Decimal(10),
  m: new Decimal(1000),
  in: new Decimal('25.4'),
  yd: new Decimal('914.4'),
});

/** Largest length accepted as input: 100 m, longer than a bolt of fabric. */
export const MAX_LENGTH_MM = new Decimal(100_000);

/** The plain (JSON) form of a Length: exact millimetres as a decimal string. */
export interface LengthJSON {
  mm: string;
}

const UNITS = Object.keys(MILLIMETRES_PER_UNIT) as LengthUnit[];

/** True when `unit` is one of the supported length units. */
export function isLengthUnit(unit: unknown): unit is LengthUnit {
  return typeof unit === 'string' && (UNITS as string[]).includes(unit);
}

function toDecimal(value: Decimal.Value, field: string): Decimal {
  if (typeof value === 'number' && Number.isNaN(value)) {
    throw new MeasureError('not-a-number', `Expected ${field} to be a number; got NaN.`, field);
  }
  let d: Decimal;
  try {
    d = new Decimal(value);
  } catch {
    throw new MeasureError('not-a-number', `Expected ${field} to be a number; got "${String(value)}".`, field);
  }
  if (d.isNaN()) {
    throw new MeasureError('not-a-number', `Expected ${field} to be a number; got NaN.`, field);
  }
  if (!d.isFinite()) {
    throw new MeasureError('not-finite', `Expected ${field} to be a finite number; got ${d.toString()}.`, field);
  }
  return d;
}

/**
 * An exact length. Immutable; arithmetic returns new values. Lengths may be
 * signed (a difference from a target); functions that take sizes check that
 * they are positive.
 */
export class Length {
  private constructor(private readonly millimetres: Decimal) {}

  /** A length of `value` in `unit`, e.g. `Length.of('6.5', 'in')`. Throws MeasureError for NaN, Infinity or more than 100 m. */
  static of(value: Decimal.Value, unit: LengthUnit, field = 'length'): Length {
    if (!isLengthUnit(unit)) {
      throw new MeasureError('unknown-unit', `Expected a unit of mm, cm, m, in or yd; got "${String(unit)}".`, field);
    }
    const mm = toDecimal(value, field).times(MILLIMETRES_PER_UNIT[unit]);
    if (mm.abs().gt(MAX_LENGTH_MM)) {
      throw new MeasureError('too-large', `Expected ${field} to be at most 100 m; got ${new Decimal(value).toString()} ${unit}.`, field);
    }
    return new Length(mm);
  }

  static inches(value: Decimal.Value): Length {
    return Length.of(value, 'in');
  }

  static millimetres(value: Decimal.Value): Length {
    return Length.of(value, 'mm');
  }

  static centimetres(value: Decimal.Value): Length {
    return Length.of(value, 'cm');
  }

  static metres(value: Decimal.Value): Length {
    return Length.of(value, 'm');
  }

  static yards(value: Decimal.Value): Length {
    return Length.of(value, 'yd');
  }

  static readonly zero: Length = new Length(new Decimal(0));

  /** Rebuilds a Length from its JSON form `{ mm: "165.1" }`. */
  static fromJSON(json: LengthJSON): Length {
    if (!isLengthJSON(json)) {
      throw new MeasureError('unparseable', 'Expected a length in the form { "mm": "<decimal>" }.');
    }
    return Length.of(json.mm, 'mm');
  }

  /** The larger of the lengths. */
  static max(first: Length, ...rest: Length[]): Length {
    return rest.reduce((a, b) => (b.gt(a) ? b : a), first);
  }

  /** The smaller of the lengths. */
  static min(first: Length, ...rest: Length[]): Length {
    return rest.reduce((a, b) => (b.lt(a) ? b : a), first);
  }

  /** Sum of the lengths (zero for none). */
  static sum(lengths: readonly Length[]): Length {
    return lengths.reduce((a, b) => a.plus(b), Length.zero);
  }

  /** Exact value in `unit`. */
  to(unit: LengthUnit): Decimal {
    return this.millimetres.dividedBy(MILLIMETRES_PER_UNIT[unit]);
  }

  /** Value in `unit` as a JavaScript number (for drawing, not for sums). */
  toNumber(unit: LengthUnit): number {
    return this.to(unit).toNumber();
  }

  get mm(): Decimal {
    return this.millimetres;
  }

  get inches(): Decimal {
    return this.to('in');
  }

  plus(other: Length): Length {
    return new Length(this.millimetres.plus(other.millimetres));
  }

  minus(other: Length): Length {
    return new Length(this.millimetres.minus(other.millimetres));
  }

  /** Scaled by a plain factor (a count, a ratio, sqrt 2). */
  times(factor: Decimal.Value): Length {
    return new Length(this.millimetres.times(toDecimal(factor, 'factor')));
  }

  dividedBy(divisor: Decimal.Value): Length {
    const d = toDecimal(divisor, 'divisor');
    if (d.isZero()) {
      throw new MeasureError('not-positive', 'Cannot divide a length by zero.', 'divisor');
    }
    return new Length(this.millimetres.dividedBy(d));
  }

  /** This length divided by another: a plain number such as pieces per strip. */
  ratio(other: Length): Decimal {
    if (other.isZero()) {
      throw new MeasureError('not-positive', 'Cannot divide by a zero length.');
    }
    return this.millimetres.dividedBy(other.millimetres);
  }

  abs(): Length {
    return new Length(this.millimetres.abs());
  }

  negated(): Length {
    return new Length(this.millimetres.negated());
  }

  compare(other: Length): number {
    return this.millimetres.comparedTo(other.millimetres);
  }

  eq(other: Length): boolean {
    return this.millimetres.eq(other.millimetres);
  }

  lt(other: Length): boolean {
    return this.millimetres.lt(other.millimetres);
  }

  lte(other: Length): boolean {
    return this.millimetres.lte(other.millimetres);
  }

  gt(other: Length): boolean {
    return this.millimetres.gt(other.millimetres);
  }

  gte(other: Length): boolean {
    return this.millimetres.gte(other.millimetres);
  }

  isZero(): boolean {
    return this.millimetres.isZero();
  }

  isPositive(): boolean {
    return this.millimetres.gt(0);
  }

  isNegative(): boolean {
    return this.millimetres.lt(0);
  }

  /** Exact value for logs and debugging, e.g. "165.1 mm". */
  toString(): string {
    return `${this.millimetres.toFixed()} mm`;
  }

  /** Plain form for JSON: `{ mm: "165.1" }` (exact). */
  toJSON(): LengthJSON {
    return { mm: this.millimetres.toFixed() };
  }
}

/** True for a value in Length's JSON form. */
export function isLengthJSON(value: unknown): value is LengthJSON {
  if (typeof value !== 'object' || value === null) return false;
  const keys = Object.keys(value);
  return keys.length === 1 && keys[0] === 'mm' && typeof (value as { mm: unknown }).mm === 'string';
}

/**
 * A `JSON.parse` reviver that turns every `{ mm: "..." }` back into a Length,
 * so a stored design result can be read back as it was computed:
 * `JSON.parse(text, reviveLengths)`.
 */
export function reviveLengths(_key: string, value: unknown): unknown {
  return isLengthJSON(value) ? Length.fromJSON(value) : value;
}

function shown(length: Length): string {
  return `${length.mm.toDecimalPlaces(3).toString()} mm (${length.to('in').toDecimalPlaces(4).toString()} in)`;
}

/** Checks that `length` is greater than zero and returns it. */
export function requirePositive(length: Length, field: string): Length {
  if (!(length instanceof Length)) {
    throw new MeasureError('not-a-number', `Expected ${field} to be a Length.`, field);
  }
  if (!length.isPositive()) {
    throw new MeasureError(
      length.isZero() ? 'not-positive' : 'negative',
      `Expected ${field} to be greater than zero; got ${shown(length)}.`,
      field,
    );
  }
  return length;
}

/** Checks that `length` is zero or more and returns it. */
export function requireNonNegative(length: Length, field: string): Length {
  if (!(length instanceof Length)) {
    throw new MeasureError('not-a-number', `Expected ${field} to be a Length.`, field);
  }
  if (length.isNegative()) {
    throw new MeasureError(
      'negative',
      `Expected ${field} to be zero or more; got ${shown(length)}.`,
      field,
    );
  }
  return length;
}

/** A width and a height (or length), e.g. a quilt top or a cut rectangle. */
export interface Size {
  width: Length;
  height: Length;
}
