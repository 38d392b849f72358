import { DomainError } from './errors';
import { foundationBlock } from './foundation-block';
import { Length } from './measure';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('foundationBlock', () => {
  it('6 in finished: trim to 6 1/2 in, foundation 7 1/2 in with 1/2 in oversize (common practice; the 1/2 in oversize is from memory)', () => {
    const b = foundationBlock({ finished: inch(6) });
    expect(inches(b.trimmed.width.rounded)).toBe('6.5');
    expect(inches(b.foundation.width)).toBe('7.5');
    expect(b.strips).toBeNull();
  });

  it('straight strips of 1 1/2 in: 5 strips of 8 1/2 in = 42 1/2 in, cut 2 in wide (derived: 7.5 / 1.5, 7.5 + 2 x 0.5)', () => {
    const b = foundationBlock({ finished: inch(6), meanStripWidth: inch('1.5'), direction: 'straight' });
    expect(b.strips!.count).toBe(Math.ceil(7.5 / 1.5));
    expect(inches(b.strips!.totalLength)).toBe(String(5 * (7.5 + 1)));
    expect(inches(b.strips!.cutWidth.rounded)).toBe('2');
  });

  it('diagonal strips: total length ~ area / width, checked by summing chords across the diagonal (derived)', () => {
    const b = foundationBlock({ finished: inch(6), meanStripWidth: inch('1.5'), overhang: Length.zero });
    const side = 7.5;
    const d = side * Math.SQRT2;
    expect(b.strips!.count).toBe(Math.ceil(d / 1.5));
    // Second way: chord of the square at 45 degrees, at distance t from the centre line, is d - 2|t|.
    const steps = 100000;
    let sum = 0;
    for (let i = 0; i < steps; i++) {
      const t = -d / 2 + ((i + 0.5) * d) / steps;
      sum += (d - 2 * Math.abs(t)) * (d / steps);
    }
    expect(b.strips!.totalLength.toNumber('in')).toBeCloseTo(sum / 1.5, 4);
  });

  it('works for a rectangle and a metric allowance (derived: 300 + 2 x 7.5 mm; 200 + 15 + 2 x 10 mm)', () => {
    const b = foundationBlock({
      finished: { width: Length.centimetres(20), height: Length.centimetres(30) },
      allowance: Length.millimetres('7.5'),
      oversize: Length.centimetres(1),
      ruler: 'millimetre',
    });
    expect(b.trimmed.height.rounded.mm.toString()).toBe('315');
    expect(b.foundation.width.mm.toString()).toBe(String(200 + 2 * 7.5 + 2 * 10));
  });

  it('refuses bad input', () => {
    expect(() => foundationBlock({ finished: Length.zero })).toThrow(DomainError);
    expect(() => foundationBlock({ finished: inch(6), oversize: inch(-1) })).toThrow(DomainError);
    expect(() => foundationBlock({ finished: inch(6), meanStripWidth: inch('0.1') })).toThrow(/allowance/);
  });
});
