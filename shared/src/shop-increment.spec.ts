import { DomainError } from './errors';
import { Length } from './measure';
import {
  cutIncrement,
  EIGHTH_YARD,
  FAT_QUARTER,
  METRIC_FAT_QUARTER,
  QUARTER_METRE,
  roundUpToIncrement,
  shopIncrement,
  TEN_CENTIMETRES,
} from './shop-increment';
import { mathjsConvert } from './testing/mathjs-units';

describe('shop increments', () => {
  it('1/8 yd is 4 1/2 in (published: 1 yd = 36 in, NIST Handbook 44 appendix C; mathjs cross-check)', () => {
    expect(EIGHTH_YARD.step.to('in').toString()).toBe('4.5');
    expect(mathjsConvert('0.125', 'yd', 'in')).toBe('4.5');
  });

  it('fat quarters are 18 x 22 in and 50 x 55 cm (common practice)', () => {
    expect(FAT_QUARTER.length.to('in').toString()).toBe('18');
    expect(FAT_QUARTER.width.to('in').toString()).toBe('22');
    expect(METRIC_FAT_QUARTER.length.to('cm').toString()).toBe('50');
    expect(METRIC_FAT_QUARTER.width.to('cm').toString()).toBe('55');
  });

  it('rounds the exact need UP to whole steps (rounding step, tested apart from the exact value)', () => {
    const need = Length.inches('45.5');
    expect(roundUpToIncrement(need, EIGHTH_YARD)).toMatchObject({ increment: 'eighth-yard', steps: 11 });
    expect(roundUpToIncrement(need, EIGHTH_YARD).length.to('yd').toString()).toBe('1.375');
    expect(roundUpToIncrement(need, TEN_CENTIMETRES).length.to('m').toString()).toBe('1.2');
    expect(roundUpToIncrement(need, QUARTER_METRE).length.to('m').toString()).toBe('1.25');
    expect(roundUpToIncrement(Length.yards(1), EIGHTH_YARD).steps).toBe(8);
  });

  it('keeps the shop minimum', () => {
    const halfMetreMinimum = cutIncrement('ten-cm-min-50', '10 cm, 50 cm minimum', Length.centimetres(10), Length.centimetres(50));
    expect(roundUpToIncrement(Length.centimetres(12), halfMetreMinimum).length.to('cm').toString()).toBe('50');
    expect(roundUpToIncrement(Length.centimetres(1), TEN_CENTIMETRES).length.to('cm').toString()).toBe('10');
  });

  it('finds increments by id', () => {
    expect(shopIncrement('metric-fat-quarter')).toBe(METRIC_FAT_QUARTER);
    expect(() => shopIncrement('bolt')).toThrow(DomainError);
    expect(() => cutIncrement('x', 'x', Length.zero)).toThrow(DomainError);
  });
});
