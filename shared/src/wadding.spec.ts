import { DomainError } from './errors';
import { Length } from './measure';
import { wadding } from './wadding';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('wadding', () => {
  it('is oversized 4 in each side like the backing: 60 x 80 in -> 68 x 88 in (common practice)', () => {
    const w = wadding({ quilt: { width: inch(60), height: inch(80) } });
    expect(inches(w.size.width)).toBe('68');
    expect(inches(w.size.height)).toBe('88');
    expect(w.fromRoll).toBeNull();
  });

  it('off a 96 in roll: one piece, cut 68 in long since 88 in fits across (derived: 88 <= 96)', () => {
    const w = wadding({ quilt: { width: inch(60), height: inch(80) }, rollWidth: inch(96) });
    expect(w.fromRoll).toMatchObject({ pieces: 1, joins: 0 });
    expect(inches(w.fromRoll!.length)).toBe('68');
  });

  it('off a 48 in roll: two 68 in pieces butted to cover the 88 in (derived: 2 x 68 = 136 < 2 x 88 = 176)', () => {
    const w = wadding({ quilt: { width: inch(60), height: inch(80) }, rollWidth: inch(48) });
    expect(w.fromRoll).toMatchObject({ pieces: 2, joins: 1 });
    expect(inches(w.fromRoll!.length)).toBe(String(Math.ceil(88 / 48) * 68));
    expect(Math.ceil(88 / 48) * 68).toBeLessThan(Math.ceil(68 / 48) * 88);
  });

  it('refuses bad input', () => {
    expect(() => wadding({ quilt: { width: Length.zero, height: inch(80) } })).toThrow(DomainError);
    expect(() => wadding({ quilt: { width: inch(60), height: inch(80) }, rollWidth: Length.zero })).toThrow(DomainError);
  });
});
