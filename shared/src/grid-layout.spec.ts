import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { DomainError } from './errors';
import { gridLayout, piecingFor, planBorders, wofStripsEndToEnd } from './grid-layout';
import { Length } from './measure';

const inch = (v: Decimal.Value) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('gridLayout', () => {
  // derived: 5 columns x 4 rows of 12 in blocks, 2 in sashing with cornerstones,
  // borders of 2 in then 6 in, 1/4 in seams, 40 in usable WOF (common practice).
  const layout = gridLayout({
    rows: 4,
    columns: 5,
    block: inch(12),
    sashing: { width: inch(2), cornerstones: true },
    borders: [inch(2), inch(6)],
  });

  it('finished size: 5 x 12 + 4 x 2 + 2 x (2 + 6) = 84 by 4 x 12 + 3 x 2 + 16 = 70 in (derived)', () => {
    expect(inches(layout.centre.width)).toBe(String(5 * 12 + 4 * 2));
    expect(inches(layout.centre.height)).toBe(String(4 * 12 + 3 * 2));
    expect(inches(layout.finished.width)).toBe('84');
    expect(inches(layout.finished.height)).toBe('70');
  });

  it('blocks cut 12 1/2 in (common practice)', () => {
    expect(layout.blocks.count).toBe(20);
    expect(inches(layout.blocks.cut.width.rounded)).toBe('12.5');
  });

  it('sashing: 16 strips in the rows, 15 between rows, 12 cornerstones, all cut 2 1/2 in wide (derived counts)', () => {
    const [inRows, betweenRows] = layout.sashing!.strips;
    expect(inRows.count).toBe((5 - 1) * 4);
    expect(betweenRows.count).toBe((4 - 1) * 5);
    expect(inches(inRows.cut.length.rounded)).toBe('12.5');
    expect(inches(inRows.cut.width.rounded)).toBe('2.5');
    expect(layout.sashing!.cornerstones!.count).toBe(3 * 4);
    expect(inches(layout.sashing!.cornerstones!.cut.rounded)).toBe('2.5');
  });

  it('borders: sides first, then top and bottom, pieced from 40 in strips (derived)', () => {
    const [first, second] = layout.borders;
    expect(inches(first.sides.finished.length)).toBe('54');
    expect(inches(first.sides.cut.length.rounded)).toBe('54.5');
    expect(first.sides.piecing).toEqual({ wofStrips: 2, joins: 1 });
    expect(inches(first.topAndBottom.finished.length)).toBe('72');
    expect(inches(second.sides.finished.length)).toBe('58');
    expect(inches(second.topAndBottom.finished.length)).toBe('84');
    // 84.5 in from 40 in strips joined with 1/4 in seams: 3 strips give 120 - 2 x 1/2 = 119 in; 2 give 79.5 in.
    expect(second.topAndBottom.piecing).toEqual({ wofStrips: 3, joins: 2 });
    expect(inches(second.topAndBottom.cut.width.rounded)).toBe('6.5');
    // joined end to end: 2 x 58.5 = 117 in -> 3 strips; 2 x 84.5 = 169 in -> 5 strips (5 x 40 - 4 x 1/2 = 198)
    expect(second.wofStrips).toBe(3 + 5);
  });

  it('without cornerstones, the strips between rows run the full width and are pieced (derived: 5 x 12 + 4 x 2 + 1/2)', () => {
    const plain = gridLayout({ rows: 4, columns: 5, block: inch(12), sashing: { width: inch(2) } });
    const [, betweenRows] = plain.sashing!.strips;
    expect(betweenRows.count).toBe(3);
    expect(inches(betweenRows.cut.length.rounded)).toBe(String(5 * 12 + 4 * 2 + 0.5));
    expect(betweenRows.piecing.joins).toBe(1);
    expect(plain.sashing!.cornerstones).toBeNull();
  });

  it('outer sashing frames the blocks (derived counts)', () => {
    const framed = gridLayout({ rows: 2, columns: 3, block: inch(10), sashing: { width: inch(2), cornerstones: true, outer: true } });
    expect(inches(framed.finished.width)).toBe(String(3 * 10 + 4 * 2));
    expect(framed.sashing!.cornerstones!.count).toBe(3 * 4);
    expect(framed.sashing!.strips[0].count).toBe(4 * 2);
  });

  it('lengthwise borders are not pieced', () => {
    const l = gridLayout({ rows: 6, columns: 5, block: inch(12), borders: [inch(4)], borderGrain: 'lengthwise' });
    expect(l.borders[0].sides.piecing).toEqual({ wofStrips: 1, joins: 0 });
    expect(l.borders[0].wofStrips).toBe(0);
  });

  it('works in metric: 20 cm blocks at 7.5 mm seams, 6 x 8, 10 cm border -> 140 x 180 cm (derived)', () => {
    const l = gridLayout({
      rows: 8,
      columns: 6,
      block: Length.centimetres(20),
      borders: [Length.centimetres(10)],
      allowance: Length.millimetres('7.5'),
      ruler: 'millimetre',
      usableWidth: Length.centimetres(105),
    });
    expect(l.finished.width.to('cm').toString()).toBe('140');
    expect(l.finished.height.to('cm').toString()).toBe('180');
    expect(l.blocks.cut.width.rounded.mm.toString()).toBe(String(200 + 2 * 7.5));
    expect([6 * 20 + 2 * 10, 8 * 20 + 2 * 10]).toEqual([140, 180]);
  });

  it('refuses bad input', () => {
    expect(() => gridLayout({ rows: 0, columns: 5, block: inch(12) })).toThrow(DomainError);
    expect(() => gridLayout({ rows: 2, columns: 2.5, block: inch(12) })).toThrow(/whole number/);
    expect(() => gridLayout({ rows: 2, columns: 2, block: inch(-12) })).toThrow(/greater than zero/);
    expect(() => gridLayout({ rows: 2, columns: 2, block: inch(12), borders: [Length.zero] })).toThrow(DomainError);
    expect(() => gridLayout({ rows: 2, columns: 2, block: inch(12), usableWidth: inch(1) })).toThrow(DomainError);
  });
});

describe('planBorders', () => {
  it('borders any centre, sides first (derived: 40 + 2 x 5, 50 + 2 x 5)', () => {
    const [b] = planBorders({ width: inch(40), height: inch(50) }, [inch(5)]);
    expect(inches(b.sides.finished.length)).toBe('50');
    expect(inches(b.topAndBottom.finished.length)).toBe('50');
    expect(inches(b.finishedAfter.width)).toBe('50');
    expect(inches(b.finishedAfter.height)).toBe('60');
  });
});

describe('piecing', () => {
  it('a strip no longer than the usable width is one strip (derived: floor(40 / 12) = 3 a strip)', () => {
    expect(piecingFor(inch(40), inch(40), inch('0.25'))).toEqual({ wofStrips: 1, joins: 0 });
    expect(wofStripsEndToEnd(inch(12), 7, inch(40), inch('0.25'))).toBe(3);
  });
});

describe('layouts: finished size equals the sum of their parts (property)', () => {
  const eighths = (min: number, max: number) => fc.integer({ min, max }).map((e) => inch(new Decimal(e).dividedBy(8)));

  it('holds for any grid, sashing and borders', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 15 }),
        fc.integer({ min: 1, max: 15 }),
        eighths(16, 160),
        eighths(16, 160),
        fc.option(fc.record({ width: eighths(4, 32), cornerstones: fc.boolean(), outer: fc.boolean() }), { nil: undefined }),
        fc.array(eighths(4, 80), { maxLength: 4 }),
        (rows, columns, bw, bh, sashing, borders) => {
          const l = gridLayout({ rows, columns, block: { width: bw, height: bh }, sashing, borders });
          const sw = sashing?.width ?? Length.zero;
          const gapsAcross = sashing ? columns - 1 + (sashing.outer ? 2 : 0) : 0;
          const gapsDown = sashing ? rows - 1 + (sashing.outer ? 2 : 0) : 0;
          const borderTotal = Length.sum(borders).times(2);
          const width = bw.times(columns).plus(sw.times(gapsAcross)).plus(borderTotal);
          const height = bh.times(rows).plus(sw.times(gapsDown)).plus(borderTotal);
          const last = l.borders[l.borders.length - 1];
          return (
            l.finished.width.eq(width) &&
            l.finished.height.eq(height) &&
            Length.sum(l.parts.across).eq(l.finished.width) &&
            Length.sum(l.parts.down).eq(l.finished.height) &&
            (last === undefined ||
              (last.topAndBottom.finished.length.eq(l.finished.width) &&
                last.sides.finished.length.eq(l.finished.height.minus(last.width.times(2)))))
          );
        },
      ),
    );
  });

  it('pieced strips are long enough and use no more WOF strips than needed', () => {
    fc.assert(
      fc.property(eighths(8, 8 * 120), eighths(8 * 20, 8 * 44), (cutLength, usable) => {
        const s = inch('0.25');
        const { wofStrips, joins } = piecingFor(cutLength, usable, s);
        const reach = (n: number) => usable.times(n).minus(s.times(2 * (n - 1)));
        return joins === wofStrips - 1 && reach(wofStrips).gte(cutLength) && (wofStrips === 1 || reach(wofStrips - 1).lt(cutLength));
      }),
    );
  });
});
