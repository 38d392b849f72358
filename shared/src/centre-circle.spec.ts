import { backgroundSquare, centreCircle, TURN_ALLOWANCE_RANGE } from './centre-circle';
import { DomainError } from './errors';
import { Length } from './measure';
import { wedgeBlock } from './wedge-block';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('centreCircle', () => {
  const plate = wedgeBlock({ kind: 'plate', blades: 12, outerRadius: inch(5), innerRadius: inch('1.5') });

  it('card covers the hole with the overlap; fabric adds the turn allowance all round (common practice 1/4 to 1/2 in)', () => {
    const c = centreCircle(plate, { overlap: inch('0.25'), turnAllowance: inch('0.375') });
    expect(inches(c.cardDiameter)).toBe('3.5');
    expect(inches(c.fabricDiameter)).toBe('4.25');
    expect(c.fanSquare).toBeNull();
    expect(inches(TURN_ALLOWANCE_RANGE.min)).toBe('0.25');
    expect(inches(TURN_ALLOWANCE_RANGE.max)).toBe('0.5');
  });

  it('covers every blade corner: card radius > inner corner radius (derived)', () => {
    const c = centreCircle(plate);
    expect(c.cardRadius.gt(plate.innerRadius)).toBe(true);
  });

  it('for a fan gives a quarter circle cut from a square of fabric radius + seam allowance (derived: 2 + 1/4 + 1/4, + 1/4)', () => {
    const fan = wedgeBlock({ kind: 'fan', blades: 5, outerRadius: inch(8), innerRadius: inch(2) });
    const c = centreCircle(fan);
    expect(inches(c.fabricRadius)).toBe('2.5');
    expect(inches(c.fanSquare!.rounded)).toBe('2.75');
    expect(2 + 0.25 + 0.25 + 0.25).toBe(2.75);
  });

  it('refuses a turn allowance over 1 in or a circle as large as the plate', () => {
    expect(() => centreCircle(plate, { turnAllowance: inch(2) })).toThrow(DomainError);
    expect(() => centreCircle(plate, { overlap: inch(4) })).toThrow(DomainError);
  });
});

describe('backgroundSquare', () => {
  it('a 10 in plate with a 1 in margin needs a 12 in finished square, cut 12 1/2 in (common practice)', () => {
    const plate = wedgeBlock({ kind: 'plate', blades: 20, finishedDiameter: inch(10), innerRadius: inch(2) });
    const bg = backgroundSquare(plate);
    expect(inches(bg.minimumFinished)).toBe('12');
    expect(inches(bg.finished)).toBe('12');
    expect(inches(bg.cut.rounded)).toBe('12.5');
  });

  it('rounds the finished square up to the step, and sets a fan in the corner (derived: 2 (6.2 + 1) = 14.4 -> 15; 8 + 2 = 10)', () => {
    const plate = wedgeBlock({ kind: 'plate', blades: 16, outerRadius: inch('6.2'), innerRadius: inch(2) });
    expect(inches(backgroundSquare(plate).finished)).toBe('15');
    expect(Math.ceil(2 * (6.2 + 1))).toBe(15);
    const fan = wedgeBlock({ kind: 'fan', blades: 5, outerRadius: inch(8), innerRadius: inch(2) });
    expect(inches(backgroundSquare(fan, { margin: inch(2) }).finished)).toBe('10');
  });
});
