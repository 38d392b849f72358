// Reading lengths as makers type them: "7 1/2", "7.5", "7½", "7 1/2 in",
// "7.5\"", "190 cm", "190mm", "1.5 m", "2 1/4 yd". Anything else is refused
// with a message that shows what is expected.

import Decimal from 'decimal.js';
import { MeasureError } from './errors';
import { Length, LengthUnit } from './measure';

export interface ParseLengthOptions {
  /** Accept "0" (for an optional border or a zero drop). Default false. */
  allowZero?: boolean;
  /** Name of the input, used in messages and on the error. Default "length". */
  field?: string;
}

/** Unicode vulgar fractions and their values as [numerator, denominator]. */
export const VULGAR_FRACTIONS: Readonly<Record<string, readonly [number, number]>> = Object.freeze({
  '½': [1, 2],
  '⅓': [1, 3],
  '⅔': [2, 3],
  '¼': [1, 4],
  '¾': [3, 4],
  '⅕': [1, 5],
  '⅖': [2, 5],
  '⅗': [3, 5],
  '⅘': [4, 5],
  '⅙': [1, 6],
  '⅚': [5, 6],
  '⅐': [1, 7],
  '⅛': [1, 8],
  '⅜': [3, 8],
  '⅝': [5, 8],
  '⅞': [7, 8],
  '⅑': [1, 9],
  '⅒': [1, 10],
});

const UNIT_WORDS: ReadonlyArray<readonly [RegExp, LengthUnit]> = [
  [/^(mm|millimetres?|millimeters?)$/, 'mm'],
  [/^(cm|centimetres?|centimeters?)$/, 'cm'],
  [/^(m|metres?|meters?)$/, 'm'],
  [/^(in|inch|inches|")$/, 'in'],
  [/^(yd|yds|yards?)$/, 'yd'],
];

const UNIT_SUFFIX =
  /^(.*?)\s*(millimetres?|millimeters?|centimetres?|centimeters?|metres?|meters?|inches|inch|yards?|yds|yd|mm|cm|in|m|")$/;

const VULGAR_CLASS = `[${Object.keys(VULGAR_FRACTIONS).join('')}]`;
const MIXED = /^(\d+) (\d+)\/(\d+)$/;
const FRACTION = /^(\d+)\/(\d+)$/;
const WITH_VULGAR = new RegExp(`^(\\d+)? ?(${VULGAR_CLASS})$`, 'u');
const DECIMAL = /^(\d+(?:\.\d+)?|\.\d+)$/;

const EXPECTED =
  'a length such as 7 1/2, 7.5, 7½, 7 1/2 in, 7.5", 190 cm, 190mm, 1.5 m or 2 1/4 yd';

const MAX_TEXT = 40;

function fail(code: 'unparseable' | 'negative' | 'not-positive', detail: string, text: string, field: string): never {
  const shown = text.length > MAX_TEXT ? `${text.slice(0, MAX_TEXT)}…` : text;
  throw new MeasureError(code, `${detail} Expected ${EXPECTED}; got "${shown}".`, field);
}

function fractionValue(numerator: string, denominator: string, text: string, field: string): Decimal {
  const den = new Decimal(denominator);
  if (den.isZero()) fail('unparseable', 'The bottom of a fraction cannot be 0.', text, field);
  return new Decimal(numerator).dividedBy(den);
}

function readNumber(body: string, text: string, field: string): Decimal {
  let m: RegExpExecArray | null;
  if ((m = MIXED.exec(body))) {
    const fraction = fractionValue(m[2], m[3], text, field);
    if (fraction.gte(1)) fail('unparseable', 'The fraction after a whole number must be less than 1.', text, field);
    return new Decimal(m[1]).plus(fraction);
  }
  if ((m = FRACTION.exec(body))) return fractionValue(m[1], m[2], text, field);
  if ((m = WITH_VULGAR.exec(body))) {
    const [num, den] = VULGAR_FRACTIONS[m[2]];
    return new Decimal(m[1] ?? 0).plus(new Decimal(num).dividedBy(den));
  }
  if ((m = DECIMAL.exec(body))) return new Decimal(m[1]);
  if (/^-/.test(body)) fail('negative', 'A length cannot be negative.', text, field);
  if (/^\d+,\d+$/.test(body)) fail('unparseable', 'Use a point for decimals (7.5, not 7,5).', text, field);
  return fail('unparseable', 'That is not a length.', text, field);
}

/**
 * Parses a typed length. Without a unit the number is read in `defaultUnit`.
 * Throws MeasureError (code "unparseable", "negative", "not-positive" or
 * "too-large") with a message naming the accepted forms.
 */
export function parseLength(text: string, defaultUnit: LengthUnit = 'in', options: ParseLengthOptions = {}): Length {
  const field = options.field ?? 'length';
  if (typeof text !== 'string') fail('unparseable', 'Nothing was typed.', String(text), field);
  if (text.length > 64) fail('unparseable', 'That is too long to be a length.', text, field);
  const normal = text
    .trim()
    .toLowerCase()
    .replace(/\u2044/g, '/')
    .replace(/[\u2033\u201d]/g, '"')
    .replace(/\s+/g, ' ');
  if (normal === '') fail('unparseable', 'Nothing was typed.', text, field);

  let body = normal;
  let unit = defaultUnit;
  const suffix = UNIT_SUFFIX.exec(normal);
  if (suffix) {
    body = suffix[1];
    unit = UNIT_WORDS.find(([pattern]) => pattern.test(suffix[2]))![1];
  }
  const value = readNumber(body, text, field);
  if (value.isZero() && !options.allowZero) fail('not-positive', 'A length must be greater than 0.', text, field);
  return Length.of(value, unit, field);
}

/** Like parseLength but returns a result object instead of throwing (for form validation). */
export function tryParseLength(
  text: string,
  defaultUnit: LengthUnit = 'in',
  options: ParseLengthOptions = {},
): { ok: true; length: Length } | { ok: false; error: MeasureError } {
  try {
    return { ok: true, length: parseLength(text, defaultUnit, options) };
  } catch (error) {
    if (error instanceof MeasureError) return { ok: false, error };
    throw error;
  }
}
