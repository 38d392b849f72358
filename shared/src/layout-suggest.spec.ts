import { DomainError } from './errors';
import { gridLayout } from './grid-layout';
import { suggestGrid } from './layout-suggest';
import { Length } from './measure';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('suggestGrid', () => {
  it('60 x 80 in from 10 in blocks: 6 columns x 8 rows, no difference (derived: 60 / 10, 80 / 10)', () => {
    const [best] = suggestGrid({ target: { width: inch(60), height: inch(80) }, block: inch(10) });
    expect(best).toMatchObject({ rows: 8, columns: 6 });
    expect(best.difference.width.isZero() && best.difference.height.isZero()).toBe(true);
  });

  it('shows the signed difference when the target cannot be met (derived: 6 x 10 - 63, 8 x 10 - 84)', () => {
    const [best] = suggestGrid({ target: { width: inch(63), height: inch(84) }, block: inch(10) });
    expect(best).toMatchObject({ rows: 8, columns: 6 });
    expect(inches(best.difference.width)).toBe('-3');
    expect(inches(best.difference.height)).toBe(String(8 * 10 - 84));
  });

  it('chooses a border width that closes the gap, preferring fewer blocks on a tie (derived)', () => {
    const results = suggestGrid({
      target: { width: inch(66), height: inch(86) },
      block: inch(10),
      border: { min: inch(2), max: inch(8), step: inch('0.5') },
    });
    expect(results[0]).toMatchObject({ rows: 7, columns: 5 });
    expect(inches(results[0].borderWidth)).toBe('8');
    expect(results[1]).toMatchObject({ rows: 8, columns: 6 });
    expect(inches(results[1].borderWidth)).toBe('3');
    // second way: 5 x 10 + 2 x 8 = 66 and 7 x 10 + 2 x 8 = 86; 6 x 10 + 2 x 3 = 66 and 8 x 10 + 2 x 3 = 86
    expect([5 * 10 + 16, 7 * 10 + 16, 6 * 10 + 6, 8 * 10 + 6]).toEqual([66, 86, 66, 86]);
  });

  it('agrees with gridLayout for every suggestion (derived: the layout sums its parts)', () => {
    const results = suggestGrid({
      target: { width: inch(90), height: inch(100) },
      block: inch(12),
      sashingWidth: inch(2),
      border: { min: inch(3), max: inch(6), step: inch(1) },
      limit: 10,
    });
    expect(results).toHaveLength(10);
    for (const s of results) {
      const layout = gridLayout({
        rows: s.rows,
        columns: s.columns,
        block: inch(12),
        sashing: { width: inch(2), cornerstones: true },
        borders: [s.borderWidth],
      });
      expect(layout.finished.width.eq(s.finished.width)).toBe(true);
      expect(layout.finished.height.eq(s.finished.height)).toBe(true);
    }
  });

  it('refuses bad ranges', () => {
    expect(() =>
      suggestGrid({ target: { width: inch(60), height: inch(80) }, block: inch(10), border: { min: inch(5), max: inch(2), step: inch(1) } }),
    ).toThrow(DomainError);
    expect(() =>
      suggestGrid({ target: { width: inch(60), height: inch(80) }, block: inch(10), border: { min: inch(0), max: inch(80), step: inch('0.125') } }),
    ).toThrow(/at most 200/);
    expect(() => suggestGrid({ target: { width: Length.zero, height: inch(80) }, block: inch(10) })).toThrow(DomainError);
  });
});
