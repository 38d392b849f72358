// Independent unit conversion for the specs: mathjs with BigNumber values
// (its inch, yard, metre definitions), so a conversion in the package is
// checked against a second implementation.

import { all, create, Unit } from 'mathjs';

const math = create(all, { number: 'BigNumber', precision: 64 });

const MATHJS_UNIT: Record<string, string> = { in: 'inch', yd: 'yard', mm: 'mm', cm: 'cm', m: 'm' };

/** `value` `unit` in millimetres, as a decimal string, computed by mathjs. */
export function mathjsToMillimetres(value: string, unit: string): string {
  const u = math.unit(math.bignumber(value), MATHJS_UNIT[unit] ?? unit) as Unit;
  return String(u.toNumeric('mm'));
}

/** Converts between any two mathjs length (or area) units, as a decimal string. */
export function mathjsConvert(value: string, from: string, to: string): string {
  const u = math.unit(math.bignumber(value), MATHJS_UNIT[from] ?? from) as Unit;
  return String(u.toNumeric(MATHJS_UNIT[to] ?? to));
}

/** Evaluates a mathjs expression with units (BigNumber) and gives the value in `unit`. */
export function mathjsEvaluate(expression: string, unit: string): string {
  const result = math.evaluate(expression) as Unit;
  return String(result.toNumeric(MATHJS_UNIT[unit] ?? unit));
}
