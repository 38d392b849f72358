import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import {
  formatCutSize,
  formatFabricLength,
  formatFinishedSize,
  formatInches,
  formatLength,
  formatMetric,
  formatSize,
} from './format-length';
import { Length } from './measure';
import { parseLength } from './parse-length';
import { EIGHTH_INCH, roundToNearestEighth, roundToNearestMillimetre } from './rounding';

describe('formatInches', () => {
  it.each([
    ['6.5', '6 1/2 in'],
    ['0.875', '7/8 in'],
    ['12', '12 in'],
    ['2.25', '2 1/4 in'],
    ['3.375', '3 3/8 in'],
    ['0', '0 in'],
  ])('writes %s in as %p (derived: whole + eighths, reduced)', (value, text) => {
    expect(formatInches(Length.inches(value))).toBe(text);
  });

  it('rounds cut sizes up and finished sizes to the nearest mark (rounding step; common practice)', () => {
    const exact = Length.inches('6.8536');
    expect(formatCutSize(exact)).toBe('6 7/8 in');
    expect(formatFinishedSize(Length.inches('8.4853'))).toBe('8 1/2 in');
    expect(formatInches(Length.inches('8.4853'), 'up')).toBe('8 1/2 in');
    expect(formatInches(Length.inches('8.51'), 'up')).toBe('8 5/8 in');
  });

  it('shows a signed difference', () => {
    expect(formatInches(Length.inches('-1.25'))).toBe('-1 1/4 in');
  });
});

describe('formatMetric', () => {
  // published: 1 in = 25.4 mm exactly (NIST SP 811 appendix B), so 6 1/2 in = 165.1 mm.
  it('writes millimetres, centimetres and metres to the millimetre (published: NIST SP 811 appendix B)', () => {
    const l = Length.inches('6.5');
    expect(formatMetric(l, 'mm')).toBe('165 mm');
    expect(formatMetric(l, 'cm')).toBe('16.5 cm');
    expect(formatMetric(l, 'mm', 'up')).toBe('166 mm');
    expect(formatMetric(Length.centimetres(190), 'cm')).toBe('190 cm');
    expect(formatMetric(Length.millimetres('1155.7'), 'm')).toBe('1.156 m');
    expect(formatLength(l, 'metric', { metricUnit: 'mm', mode: 'up' })).toBe('166 mm');
    expect(formatLength(l, 'imperial')).toBe('6 1/2 in');
  });
});

describe('formatSize and formatFabricLength', () => {
  it('writes sizes as width x height (published: 1 in = 25.4 mm)', () => {
    expect(formatSize({ width: Length.inches('6.5'), height: Length.inches(12) })).toBe('6 1/2 x 12 in');
    expect(formatSize({ width: Length.centimetres(135), height: Length.centimetres(190) }, 'metric')).toBe('135 x 190 cm');
  });

  it('writes fabric in yards to 1/8 yd or metres to 1 cm (derived: 49.5 / 36 = 1.375 yd)', () => {
    expect(formatFabricLength(Length.inches('49.5'), 'yd')).toBe('1 3/8 yd');
    expect(49.5 / 36).toBe(1.375);
    expect(formatFabricLength(Length.centimetres(120), 'm')).toBe('1.2 m');
  });
});

describe('parse(format(x)) round-trips within display precision (property)', () => {
  const micrometres = fc.integer({ min: 1_000, max: 5_000_000 });

  it('inches: the text reads back as the nearest 1/8 in, within 1/16 in of x', () => {
    fc.assert(
      fc.property(micrometres, (um) => {
        const x = Length.millimetres(new Decimal(um).dividedBy(1000));
        const back = parseLength(formatInches(x), 'in', { allowZero: true });
        return back.eq(roundToNearestEighth(x)) && back.minus(x).abs().lte(EIGHTH_INCH.dividedBy(2));
      }),
    );
  });

  it('metric: the text reads back as the nearest millimetre, within 0.5 mm of x', () => {
    fc.assert(
      fc.property(micrometres, fc.constantFrom<'mm' | 'cm' | 'm'>('mm', 'cm', 'm'), (um, unit) => {
        const x = Length.millimetres(new Decimal(um).dividedBy(1000));
        const back = parseLength(formatMetric(x, unit));
        return back.eq(roundToNearestMillimetre(x)) && back.minus(x).abs().lte(Length.millimetres('0.5'));
      }),
    );
  });

  it('cut sizes read back at or above x', () => {
    fc.assert(
      fc.property(micrometres, (um) => {
        const x = Length.millimetres(new Decimal(um).dividedBy(1000));
        return parseLength(formatCutSize(x)).gte(x) && parseLength(formatCutSize(x, 'metric', 'mm')).gte(x);
      }),
    );
  });
});
