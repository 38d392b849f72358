import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { Length } from './measure';
import {
  cutSize,
  EIGHTH_INCH,
  roundDownToEighth,
  roundToNearestEighth,
  roundToNearestMillimetre,
  roundToStep,
  roundUpToEighth,
  roundUpToMillimetre,
} from './rounding';

const inches = (v: Decimal.Value) => Length.inches(v);
const asInches = (l: Length) => l.to('in').toString();

describe('rounding to ruler marks', () => {
  // common practice: cut sizes round up to the next 1/8 in ruler mark so a
  // piece is never short; finished sizes are shown to the nearest mark.
  it('rounds cut sizes UP to the next 1/8 in (common practice)', () => {
    expect(asInches(roundUpToEighth(inches('6.8536')))).toBe('6.875');
    expect(asInches(roundUpToEighth(inches('6.876')))).toBe('7');
    expect(asInches(roundUpToEighth(inches('6.5')))).toBe('6.5');
  });

  it('rounds finished sizes to the NEAREST 1/8 in, halves up (common practice)', () => {
    expect(asInches(roundToNearestEighth(inches('8.4853')))).toBe('8.5');
    expect(asInches(roundToNearestEighth(inches('8.0625')))).toBe('8.125');
    expect(asInches(roundToNearestEighth(inches('8.06')))).toBe('8');
  });

  it('rounds down when asked', () => {
    expect(asInches(roundDownToEighth(inches('8.1249')))).toBe('8');
  });

  it('rounds metric cut sizes up to 1 mm and finished sizes to the nearest 1 mm (common practice)', () => {
    expect(roundUpToMillimetre(Length.millimetres('165.1')).mm.toString()).toBe('166');
    expect(roundToNearestMillimetre(Length.millimetres('165.1')).mm.toString()).toBe('165');
    expect(roundToNearestMillimetre(Length.millimetres('165.5')).mm.toString()).toBe('166');
  });

  it('does not push a value on a mark up by calculation noise (derived)', () => {
    const noisy = inches(new Decimal(2).sqrt().times(new Decimal(6.5).dividedBy(new Decimal(2).sqrt())));
    expect(asInches(roundUpToEighth(noisy))).toBe('6.5');
  });

  it('pairs the exact and the rounded cut value', () => {
    const c = cutSize(inches('0.8536'));
    expect(asInches(c.exact)).toBe('0.8536');
    expect(asInches(c.rounded)).toBe('0.875');
    expect(cutSize(Length.millimetres('10.2'), 'millimetre').rounded.mm.toString()).toBe('11');
  });

  it('never rounds a cut below the exact value, nor more than one mark above (derived property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000_000 }), (micro) => {
        const exact = Length.millimetres(new Decimal(micro).dividedBy(1000));
        const up = roundUpToEighth(exact);
        const near = roundToNearestEighth(exact);
        const onMark = up.ratio(EIGHTH_INCH).isInteger();
        return (
          onMark &&
          up.plus(Length.millimetres('0.000001')).gte(exact) &&
          up.minus(exact).lt(EIGHTH_INCH) &&
          near.minus(exact).abs().lte(EIGHTH_INCH.dividedBy(2))
        );
      }),
    );
  });

  it('refuses a zero step', () => {
    expect(() => roundToStep(inches(1), Length.zero, 'up')).toThrow(/greater than zero/);
  });
});
