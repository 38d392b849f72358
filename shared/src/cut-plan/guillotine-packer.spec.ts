import { VARIANTS, emptyLeaves, fillRegion, fillTree, emptyNode, type CutNode, type FillContext } from './guillotine-packer';
import type { Orientation } from './plan-model';

function option(type: number, w: number, h: number, rotated = false): Orientation {
  return { type, w, h, rotated, area: w * h };
}

function context(options: Orientation[], counts: number[], build = true, variant = VARIANTS[0]): FillContext {
  return {
    options,
    counts: Int32Array.from(counts),
    mask: new Uint8Array(counts.length).fill(1),
    rank: Float64Array.from(counts, (_, t) => Math.max(...options.filter((o) => o.type === t).map((o) => o.area), 0)),
    weight: new Float64Array(counts.length).fill(1),
    budget: Infinity,
    minSide: 0,
    variant,
    build,
    work: 0,
    length: 0,
    placedArea: 0,
    placedValue: 0,
    placedCount: 0,
  };
}

/** Checks every split's parts tile it exactly, in order; returns the pieces. */
function tiles(node: CutNode): CutNode[] {
  if (node.kind !== 'split') return node.kind === 'piece' ? [node] : [];
  let at = node.dir === 'h' ? node.y : node.x;
  const out: CutNode[] = [];
  for (const child of node.children) {
    if (node.dir === 'h') {
      expect([child.x, child.w, child.y]).toEqual([node.x, node.w, at]);
      at += child.h;
    } else {
      expect([child.y, child.h, child.x]).toEqual([node.y, node.h, at]);
      at += child.w;
    }
    out.push(...tiles(child));
  }
  expect(at).toBe(node.dir === 'h' ? node.y + node.h : node.x + node.w);
  return out;
}

describe('guillotine packer', () => {
  it('fills a panel exactly tiled by one size, in strips', () => {
    // derived: 19500 / 6500 = 3 across, 26000 / 6500 = 4 down.
    const ctx = context([option(0, 6500, 6500)], [12]);
    const tree = fillRegion(ctx, 0, 0, 19500, 26000) as CutNode;
    expect(tiles(tree)).toHaveLength(12);
    expect(ctx.counts[0]).toBe(0);
    expect(tree).toMatchObject({ kind: 'split', dir: 'h' });
  });

  it('fills the rest of a strip with smaller pieces, and the space above shorter ones', () => {
    const ctx = context([option(0, 6000, 6000), option(1, 3000, 3000)], [1, 20]);
    const tree = fillRegion(ctx, 0, 0, 9000, 6000) as CutNode;
    // derived: 6 x 6 plus a 3 x 6 column of two 3 x 3 squares fills 9 x 6.
    expect(tiles(tree)).toHaveLength(3);
    expect(ctx.placedArea).toBe(9000 * 6000);
  });

  it('places exactly the same in a trial run as in a real one', () => {
    const options = [option(0, 4500, 4500), option(1, 2500, 6500), option(1, 6500, 2500, true), option(2, 2500, 2500)];
    for (const variant of VARIANTS) {
      const trial = context(options, [7, 9, 30], false, variant);
      fillRegion(trial, 0, 0, 21000, 17250);
      const real = context(options, [7, 9, 30], true, variant);
      const tree = fillRegion(real, 0, 0, 21000, 17250) as CutNode;
      expect([trial.placedArea, trial.placedCount, [...trial.counts]]).toEqual([real.placedArea, real.placedCount, [...real.counts]]);
      expect(tiles(tree)).toHaveLength(real.placedCount);
    }
  });

  it('stops at the budget', () => {
    const ctx = context([option(0, 1000, 1000)], [50]);
    ctx.budget = 7;
    fillRegion(ctx, 0, 0, 10000, 10000);
    expect(ctx.placedCount).toBe(7);
  });

  it('cuts unlimited length in horizontal strips only, leaving the rest of the bolt empty', () => {
    const ctx = context([option(0, 6500, 6500)], [40]);
    const tree = fillRegion(ctx, 0, 0, 42000, Infinity) as CutNode;
    expect(tree.kind).toBe('split');
    if (tree.kind !== 'split') return;
    expect(tree.dir).toBe('h');
    const rest = tree.children[tree.children.length - 1];
    // common practice: 6 squares per 42 in strip, 7 strips, 45 1/2 in.
    expect(rest).toMatchObject({ kind: 'empty', y: 45500, h: Infinity });
  });

  it('fills the empty leaves of an existing tree in place', () => {
    const root: CutNode = { kind: 'split', dir: 'v', x: 0, y: 0, w: 10000, h: 5000, children: [emptyNode(0, 0, 5000, 5000), emptyNode(5000, 0, 5000, 5000)] };
    const ctx = context([option(0, 5000, 5000)], [2]);
    fillTree(root, ctx);
    expect(emptyLeaves(root)).toHaveLength(0);
    expect(tiles(root)).toHaveLength(2);
  });
});
