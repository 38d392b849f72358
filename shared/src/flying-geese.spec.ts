import { flyingGeeseCut } from './flying-geese';
import { Length } from './measure';
import { boundingBox, edgeLengths, offsetPolygon } from './testing/offset-polygon';

const inch = (v: number | string) => Length.inches(v);
const num = (l: Length) => l.toNumber('in');
const inches = (l: Length) => l.to('in').toString();

describe('flying geese', () => {
  it('four at a time: 3 x 6 in geese from a 7 1/4 in square and four 3 7/8 in squares (common practice, from memory; exact sizes derived below)', () => {
    const cut = flyingGeeseCut({ width: inch(6), height: inch(3) });
    const [goose, sky] = cut.pieces;
    expect(inches(goose.width.rounded)).toBe('7.25');
    expect(inches(sky.width.rounded)).toBe('3.875');
    expect(sky.quantity).toBe(4);
    expect(cut.unitsPerBatch).toBe(4);
    expect(inches(cut.unfinished!.width)).toBe('6.5');
    expect(inches(cut.unfinished!.height)).toBe('3.5');
  });

  it('four at a time: the exact squares are the goose and sky triangles grown by 1/4 in (derived; clipper-lib)', () => {
    const cut = flyingGeeseCut({ width: inch(6), height: inch(3) });
    const goose = offsetPolygon([{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 3, y: 3 }], 0.25);
    expect(Math.max(...edgeLengths(goose))).toBeCloseTo(num(cut.pieces[0].width.exact), 5);
    const sky = offsetPolygon([{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 0, y: 3 }], 0.25);
    expect(boundingBox(sky).width).toBeCloseTo(num(cut.pieces[1].width.exact), 5);
  });

  it('stitch and flip: a 3 1/2 x 6 1/2 in rectangle and two 3 1/2 in squares (common practice, from memory)', () => {
    const cut = flyingGeeseCut({ width: inch(6), height: inch(3) }, { method: 'stitch-and-flip' });
    expect(inches(cut.pieces[0].width.rounded)).toBe('6.5');
    expect(inches(cut.pieces[0].height.rounded)).toBe('3.5');
    expect(inches(cut.pieces[1].width.rounded)).toBe('3.5');
    expect(cut.pieces[1].quantity).toBe(2);
    expect(cut.unitsPerBatch).toBe(1);
  });

  it('refuses geese that are not twice as wide as tall', () => {
    expect(() => flyingGeeseCut({ width: inch(5), height: inch(3) })).toThrow(/twice as wide as tall/);
  });
});
