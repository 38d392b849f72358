import { cutSequence, normalizeTree, trimUnbounded } from './cut-sequence';
import { emptyNode, type CutNode, type PieceNode } from './guillotine-packer';

const piece = (x: number, y: number, w: number, h: number): PieceNode => ({ kind: 'piece', x, y, w, h, type: 0, pinned: -1, rotated: false });
const describe_ = { describe: (n: PieceNode) => ({ pieceId: `at ${n.x / 1000},${n.y / 1000}`, copy: 1 }) };

describe('cut sequence', () => {
  it('gathers parallel cuts into one split and joins neighbouring empty parts', () => {
    const tree: CutNode = {
      kind: 'split', dir: 'h', x: 0, y: 0, w: 4000, h: 6000,
      children: [
        piece(0, 0, 4000, 2000),
        { kind: 'split', dir: 'h', x: 0, y: 2000, w: 4000, h: 4000, children: [emptyNode(0, 2000, 4000, 1000), emptyNode(0, 3000, 4000, 3000)] },
      ],
    };
    expect(normalizeTree(tree)).toEqual({
      kind: 'split', dir: 'h', x: 0, y: 0, w: 4000, h: 6000,
      children: [piece(0, 0, 4000, 2000), emptyNode(0, 2000, 4000, 4000)],
    });
  });

  it('lists the strips first, then each strip\'s sub-cuts, measured from the edge just cut', () => {
    // A 13 x 6 panel: two strips 3 deep; the first sub-cut into 6 + 7, the second into 4 + 9.
    const tree: CutNode = {
      kind: 'split', dir: 'h', x: 0, y: 0, w: 13000, h: 6000,
      children: [
        { kind: 'split', dir: 'v', x: 0, y: 0, w: 13000, h: 3000, children: [piece(0, 0, 6000, 3000), piece(6000, 0, 7000, 3000)] },
        { kind: 'split', dir: 'v', x: 0, y: 3000, w: 13000, h: 3000, children: [piece(0, 3000, 4000, 3000), emptyNode(4000, 3000, 9000, 3000)] },
      ],
    };
    const { cuts, offcuts } = cutSequence(tree, { ...describe_, minimumOffcut: { w: 2500, h: 2500 } });
    expect(cuts.map((c) => [c.step, c.stage, c.region, c.direction, c.at, c.length, c.cutsOff.label, c.cutsOff.content, c.remaining.label, c.remaining.content])).toEqual([
      [1, 1, 'panel', 'horizontal', 3, 13, '1', 'strip', '2', 'strip'],
      [2, 2, '1', 'vertical', 6, 3, '1.1', 'piece', '1.2', 'piece'],
      [3, 2, '2', 'vertical', 4, 3, '2.1', 'piece', '2.2', 'offcut'],
    ]);
    expect(cuts[2].regionRect).toEqual({ x: 0, y: 3, width: 13, height: 3 });
    expect(offcuts).toEqual([{ x: 4, y: 3, width: 9, height: 3 }]);
  });

  it('calls a leftover smaller than the minimum offcut waste', () => {
    const tree: CutNode = { kind: 'split', dir: 'v', x: 0, y: 0, w: 5000, h: 3000, children: [piece(0, 0, 4000, 3000), emptyNode(4000, 0, 1000, 3000)] };
    const { cuts, offcuts } = cutSequence(tree, { ...describe_, minimumOffcut: { w: 2500, h: 2500 } });
    expect(cuts[0].remaining.content).toBe('waste');
    expect(offcuts).toEqual([]);
  });

  it('cuts unlimited fabric at the end of its last strip', () => {
    const tree: CutNode = {
      kind: 'split', dir: 'h', x: 0, y: 0, w: 42000, h: Infinity,
      children: [piece(0, 0, 42000, 2500), piece(0, 2500, 42000, 2500), emptyNode(0, 5000, 42000, Infinity)],
    };
    const { tree: trimmed, length } = trimUnbounded(tree);
    expect(length).toBe(5000);
    expect(trimmed).toMatchObject({ h: 5000, children: [piece(0, 0, 42000, 2500), piece(0, 2500, 42000, 2500)] });
    expect(trimUnbounded(emptyNode(0, 0, 42000, Infinity))).toEqual({ tree: null, length: 0 });
  });
});
