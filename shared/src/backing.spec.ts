import { backing } from './backing';
import { DomainError } from './errors';
import { Length } from './measure';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('backing', () => {
  // 60 x 80 in top, 4 in each side (common practice), 40 in usable WOF (common practice), 1/2 in seams (common practice, from memory).
  const plan = backing({ quilt: { width: inch(60), height: inch(80) } });

  it('is 4 in larger than the top on every side: 68 x 88 in (common practice)', () => {
    expect(inches(plan.required.width)).toBe('68');
    expect(inches(plan.required.height)).toBe('88');
  });

  it('seams along the length use least: 2 panels of 88 in = 176 in, against 3 of 68 in = 204 in (derived)', () => {
    expect(plan.pieced).toMatchObject({ method: 'seams-along-length', panels: 2, seams: 1 });
    expect(inches(plan.pieced.fabricLength)).toBe('176');
    expect(plan.alternative).toMatchObject({ method: 'seams-across-width', panels: 3 });
    expect(inches(plan.alternative!.fabricLength)).toBe('204');
    // two 40 in panels joined with a 1/2 in seam cover 79 in >= 68 in (derived)
    expect(2 * 40 - 2 * 0.5).toBeGreaterThanOrEqual(68);
    // 176 in = 4.89 yd -> 5 yd in 1/8 yd steps (rounding step)
    expect(plan.pieced.purchase.length.to('yd').toString()).toBe('5');
  });

  it('cuts wide backing (108 in, common practice) the short way: 68 in off the bolt', () => {
    expect(plan.wide).toMatchObject({ fabric: 'wide-backing', panels: 1 });
    expect(inches(plan.wide!.fabricLength)).toBe('68');
  });

  it('a small quilt fits one width (derived: 30 + 8 = 38 <= 40 in; one panel of 40 + 8 = 48 in)', () => {
    const small = backing({ quilt: { width: inch(30), height: inch(40) } });
    expect(small.pieced).toMatchObject({ method: 'single-width', panels: 1 });
    // 38 x 48 in: the 38 in width fits the 40 in fabric, so one 48 in panel
    expect(inches(small.pieced.fabricLength)).toBe('48');
    expect(30 + 2 * 4).toBeLessThanOrEqual(40);
    expect(40 + 2 * 4).toBe(48);
  });

  it('a king quilt wider than wide backing both ways has no wide option (derived)', () => {
    const king = backing({ quilt: { width: inch(110), height: inch(110) } });
    expect(king.wide).toBeNull();
    // 118 in wide: 3 panels give 3 x 40 - 2 x 1 = 118 in (derived)
    expect(king.pieced.panels).toBe(3);
    expect(3 * 40 - 2 * 2 * 0.5).toBeGreaterThanOrEqual(118);
    expect(2 * 40 - 2 * 0.5).toBeLessThan(118);
  });

  it('takes a 6 in oversize and refuses bad input', () => {
    expect(inches(backing({ quilt: { width: inch(60), height: inch(80) }, oversize: inch(6) }).required.width)).toBe('72');
    expect(() => backing({ quilt: { width: inch(-1), height: inch(80) } })).toThrow(DomainError);
    expect(() => backing({ quilt: { width: inch(60), height: inch(80) }, usableWidth: inch(1) })).toThrow(DomainError);
  });
});
