import { cushionCover } from './cushion-cover';
import { DomainError } from './errors';
import { Length } from './measure';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('cushionCover', () => {
  it('18 in pad: front 19 x 19 in at 1/2 in seams; backs 19 x 12 1/2 in with a 4 in overlap (common practice, from memory: 1/2 in cushion seams, 4 in overlap, 1 in hem)', () => {
    const cover = cushionCover({ pad: { width: inch(18), height: inch(18) } });
    expect(inches(cover.front.width.rounded)).toBe('19');
    expect(inches(cover.back.width.rounded)).toBe('19');
    // (18 + 4) / 2 + 1/2 seam + 1 in hem = 12 1/2 in
    expect(inches(cover.back.height.rounded)).toBe('12.5');
  });

  it('the two back halves cover the pad exactly once the overlap is taken off (derived)', () => {
    const pad = { width: Length.centimetres(40), height: Length.centimetres(45) };
    const overlap = Length.centimetres(12);
    const cover = cushionCover({ pad, overlap, allowance: Length.centimetres(1), ruler: 'millimetre' });
    expect(cover.back.finishedHeight.times(2).minus(overlap).eq(pad.height)).toBe(true);
    expect(cover.front.height.rounded.to('cm').toString()).toBe('47');
  });

  it('refuses an overlap as large as the pad', () => {
    expect(() => cushionCover({ pad: { width: inch(12), height: inch(12) }, overlap: inch(12) })).toThrow(DomainError);
  });
});
