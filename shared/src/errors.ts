// Typed errors for bad input to the domain maths, and the small guards that
// raise them. Every function in this package either returns a sensible value
// or throws a DomainError; none returns NaN or a negative size.

/** Machine-readable reason for a DomainError. */
export type DomainErrorCode =
  | 'not-a-number'
  | 'not-finite'
  | 'not-positive'
  | 'negative'
  | 'not-integer'
  | 'too-large'
  | 'too-small'
  | 'unparseable'
  | 'unknown-unit'
  | 'allowance-too-large'
  | 'too-few-blades'
  | 'inner-not-less-than-outer'
  | 'shape-mismatch'
  | 'piece-does-not-fit'
  | 'unknown-preset'
  | 'out-of-range';

/**
 * Raised for input the maths cannot work with. `code` is stable for programs
 * (the server maps it to a 400 response); `message` is written for the maker;
 * `field` names the input at fault when there is one.
 */
export class DomainError extends Error {
  override readonly name: string = 'DomainError';

  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    Object.setPrototypeOf(this, new.target.prototype);
  }

  /** Plain form for an API response body. */
  toJSON(): { name: string; code: DomainErrorCode; message: string; field?: string } {
    return this.field === undefined
      ? { name: this.name, code: this.code, message: this.message }
      : { name: this.name, code: this.code, message: this.message, field: this.field };
  }
}

/** Raised for lengths that cannot be read or held: bad text, NaN, too large. */
export class MeasureError extends DomainError {
  override readonly name: string = 'MeasureError';
}

/** Largest count of pieces, blocks, rows or blades the maths accepts. */
export const MAX_COUNT = 100_000;

/** Checks that `value` is a whole number from `min` to `max` and returns it. */
export function requireCount(value: number, field: string, min = 1, max = MAX_COUNT): number {
  if (typeof value !== 'number' || Number.isNaN(value)) {
    throw new DomainError('not-a-number', `Expected ${field} to be a whole number; got ${String(value)}.`, field);
  }
  if (!Number.isFinite(value)) {
    throw new DomainError('not-finite', `Expected ${field} to be a whole number; got ${String(value)}.`, field);
  }
  if (!Number.isInteger(value)) {
    throw new DomainError('not-integer', `Expected ${field} to be a whole number; got ${value}.`, field);
  }
  if (value < min) {
    throw new DomainError(
      min === 1 ? 'not-positive' : 'too-small',
      `Expected ${field} to be at least ${min}; got ${value}.`,
      field,
    );
  }
  if (value > max) {
    throw new DomainError('too-large', `Expected ${field} to be at most ${max}; got ${value}.`, field);
  }
  return value;
}
