import Decimal from 'decimal.js';
import { DomainError } from './errors';
import { Length } from './measure';
import {
  applyDimensionalChange,
  dimensionalChangePercent,
  lengthAfterShrinking,
  lengthBeforeShrinking,
  PRESHRUNK_LIMIT_PERCENT,
  sizeAfterQuiltingAndWashing,
  topSizeForTarget,
  TYPICAL_TAKE_UP_PERCENT,
} from './shrinkage';

const cm = (v: number | string) => Length.centimetres(v);
const inch = (v: number | string) => Length.inches(v);

describe('dimensional change (published definition: AATCC TM135, AATCC TM150, ISO 5077:2007)', () => {
  it('a 50 cm benchmark distance measuring 48.5 cm after washing is -3 % (published formula; derived numbers)', () => {
    const change = dimensionalChangePercent(cm(50), cm('48.5'));
    expect(change.toString()).toBe('-3');
    // second way: plain floating point, 100 (after - before) / before
    expect(change.toNumber()).toBeCloseTo((100 * (48.5 - 50)) / 50, 12);
  });

  it('growth is positive (published formula; derived: 100 (51 - 50) / 50 = 2)', () => {
    expect(dimensionalChangePercent(cm(50), cm(51)).toString()).toBe('2');
  });

  it('applies a change to a length (derived: 100 x 0.97)', () => {
    expect(applyDimensionalChange(cm(100), -3).to('cm').toString()).toBe('97');
    expect(100 * 0.97).toBeCloseTo(97, 12);
  });
});

describe('shrinkage and take-up applied to plan sizes', () => {
  it('buys 60 in / 0.97 = 61.856 in to have 60 in after a 3 % shrink (derived; checked by multiplying back)', () => {
    const before = lengthBeforeShrinking(inch(60), 3);
    expect(before.to('in').toDecimalPlaces(3).toString()).toBe('61.856');
    expect(lengthAfterShrinking(before, 3).to('in').toDecimalPlaces(12).toString()).toBe('60');
  });

  it('pieces a 62 1/2 in top for a 60 in quilt with 4 % take-up (derived: 62.5 x 0.96 = 60)', () => {
    const top = topSizeForTarget({ width: inch(60), height: inch(80) }, { takeUpPercent: 4 });
    expect(top.width.to('in').toString()).toBe('62.5');
    expect(new Decimal(62.5).times(0.96).toString()).toBe('60');
  });

  it('combines take-up and laundering and undoes them exactly (derived: inverse operations)', () => {
    const target = { width: inch(60), height: inch(80) };
    const shrink = { takeUpPercent: 4, launderingPercent: '2.5' };
    const back = sizeAfterQuiltingAndWashing(topSizeForTarget(target, shrink), shrink);
    expect(back.width.to('in').toDecimalPlaces(12).toString()).toBe('60');
    expect(back.height.to('in').toDecimalPlaces(12).toString()).toBe('80');
  });

  it('keeps the common-practice figures: take-up 3 to 5 %, pre-shrunk under 3 %', () => {
    expect(TYPICAL_TAKE_UP_PERCENT).toEqual({ min: 3, max: 5 });
    expect(PRESHRUNK_LIMIT_PERCENT).toBe(3);
  });

  it.each([[-1], [50], [Number.NaN], [Number.POSITIVE_INFINITY], ['abc']])('refuses a shrinkage of %p', (p) => {
    expect(() => lengthBeforeShrinking(inch(60), p as Decimal.Value)).toThrow(DomainError);
  });

  it('refuses a zero length before washing', () => {
    expect(() => dimensionalChangePercent(Length.zero, cm(1))).toThrow(DomainError);
  });
});
