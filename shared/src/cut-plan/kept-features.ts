// Kept features: a pocket, a label or embroidery that must lie whole inside
// one piece. Such a piece has a fixed place in its panel (centred on the
// feature or at a given offset), so it is placed before anything else and
// the rest of the panel is cut around it with edge-to-edge cuts.

import type { ShortfallReason } from './cut-plan-types';
import { emptyNode, type Box, type CutNode } from './guillotine-packer';
import { allowedTurns, sourceAllows, type BinModel, type PlanModel } from './plan-model';
import { stepsDown } from './scaled-units';

export interface PinnedPlacement extends Box {
  /** Index into PlanModel.pinned. */
  pinned: number;
  bin: number;
  rotated: boolean;
}

export interface PinnedFailure {
  pinned: number;
  reason: ShortfallReason;
  detail: string;
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

/** Which cut frames a fixed piece first: horizontal, vertical, or whichever keeps the largest free part. */
export type FrameFirst = 'h' | 'v' | 'largest-free';

/** Frames one fixed rectangle inside a region with at most four cuts. */
function frame(region: Box, r: Box, piece: CutNode, first: FrameFirst): CutNode {
  const parts = (dir: 'h' | 'v'): CutNode => {
    // dir 'h': top band, middle band (left | piece | right), bottom band.
    const children: CutNode[] = [];
    const middle: CutNode[] = [];
    if (dir === 'h') {
      if (r.y > region.y) children.push(emptyNode(region.x, region.y, region.w, r.y - region.y));
      if (r.x > region.x) middle.push(emptyNode(region.x, r.y, r.x - region.x, r.h));
      middle.push(piece);
      const right = region.x + region.w - (r.x + r.w);
      if (right > 0) middle.push(emptyNode(r.x + r.w, r.y, right, r.h));
      children.push(
        middle.length === 1 ? piece : { kind: 'split', dir: 'v', x: region.x, y: r.y, w: region.w, h: r.h, children: middle },
      );
      const below = region.y + region.h - (r.y + r.h);
      if (below > 0) children.push(emptyNode(region.x, r.y + r.h, region.w, below));
    } else {
      if (r.x > region.x) children.push(emptyNode(region.x, region.y, r.x - region.x, region.h));
      if (r.y > region.y) middle.push(emptyNode(r.x, region.y, r.w, r.y - region.y));
      middle.push(piece);
      const below = region.y + region.h - (r.y + r.h);
      if (below > 0) middle.push(emptyNode(r.x, r.y + r.h, r.w, below));
      children.push(
        middle.length === 1 ? piece : { kind: 'split', dir: 'h', x: r.x, y: region.y, w: r.w, h: region.h, children: middle },
      );
      const right = region.x + region.w - (r.x + r.w);
      if (right > 0) children.push(emptyNode(r.x + r.w, region.y, right, region.h));
    }
    return children.length === 1 ? children[0] : { kind: 'split', dir, ...region, children };
  };
  const largestFree = (node: CutNode): number =>
    node.kind === 'empty' ? node.w * node.h : node.kind === 'split' ? Math.max(0, ...node.children.map(largestFree)) : 0;
  if (first !== 'largest-free') return parts(first);
  const across = parts('h');
  const down = parts('v');
  return largestFree(down) > largestFree(across) ? down : across;
}

/**
 * The cut tree that frees every fixed rectangle by edge-to-edge cuts, with
 * empty regions for the rest; null when the rectangles cannot all be cut
 * apart that way (they interlock like a pinwheel).
 */
export function separate(
  region: Box,
  fixed: { box: Box; node: CutNode }[],
  first: FrameFirst = 'largest-free',
): CutNode | null {
  if (fixed.length === 0) return emptyNode(region.x, region.y, region.w, region.h);
  if (fixed.length === 1) return frame(region, fixed[0].box, fixed[0].node, first);
  for (const dir of ['h', 'v'] as const) {
    const start = dir === 'h' ? region.y : region.x;
    const end = start + (dir === 'h' ? region.h : region.w);
    const edges = fixed
      .flatMap(({ box }) => (dir === 'h' ? [box.y, box.y + box.h] : [box.x, box.x + box.w]))
      .filter((at) => at > start && at < end)
      .sort((a, b) => a - b);
    for (const at of edges) {
      const firstPart = fixed.filter(({ box }) => (dir === 'h' ? box.y + box.h <= at : box.x + box.w <= at));
      const secondPart = fixed.filter(({ box }) => (dir === 'h' ? box.y >= at : box.x >= at));
      if (firstPart.length === 0 || secondPart.length === 0 || firstPart.length + secondPart.length !== fixed.length) continue;
      const a: Box = dir === 'h' ? { ...region, h: at - region.y } : { ...region, w: at - region.x };
      const b: Box =
        dir === 'h'
          ? { ...region, y: at, h: region.y + region.h - at }
          : { ...region, x: at, w: region.x + region.w - at };
      const left = separate(a, firstPart, first);
      const right = left && separate(b, secondPart, first);
      if (!left || !right) return null;
      return { kind: 'split', dir, ...region, children: [left, right] };
    }
  }
  return null;
}

/** Places every pinned piece it can, in input order; the rest fail with a reason. */
export function placePinnedPieces(model: PlanModel): { placements: PinnedPlacement[]; failures: PinnedFailure[] } {
  const placements: PinnedPlacement[] = [];
  const failures: PinnedFailure[] = [];
  model.pinned.forEach((pin, index) => {
    const bin: BinModel = model.bins[pin.feature.bin];
    const fail = (reason: ShortfallReason, detail: string) => failures.push({ pinned: index, reason, detail });
    if (!sourceAllows(pin.source, bin)) {
      fail('rule-not-met', `its source rule does not allow panel "${bin.panelId}", where the kept feature is`);
      return;
    }
    const turns = allowedTurns(pin, bin);
    const f = pin.feature;
    const ways: { w: number; h: number; rotated: boolean }[] = [];
    if (turns.unturned) ways.push({ w: pin.w, h: pin.h, rotated: false });
    if (turns.turned && pin.pin.placement === 'centred' && pin.w !== pin.h) ways.push({ w: pin.h, h: pin.w, rotated: true });
    if (ways.length === 0) {
      fail('rule-not-met', 'the grain or directional-print rules do not allow it in the kept feature\'s panel');
      return;
    }
    let problem = '';
    let problemReason: ShortfallReason = 'rule-not-met';
    for (const way of ways) {
      let box: Box;
      if (pin.pin.placement === 'centred') {
        box = { x: Math.floor((2 * f.x + f.w - way.w) / 2), y: Math.floor((2 * f.y + f.h - way.h) / 2), w: way.w, h: way.h };
      } else {
        box = { x: f.x - stepsDown(pin.pin.placement.x), y: f.y - stepsDown(pin.pin.placement.y), w: way.w, h: way.h };
      }
      if (box.x > f.x || box.y > f.y || box.x + box.w < f.x + f.w || box.y + box.h < f.y + f.h) {
        problem = 'the kept feature does not fit inside the piece where it is asked to be';
        continue;
      }
      if (box.x < 0 || box.y < 0 || box.x + box.w > bin.w || box.y + box.h > bin.h) {
        if (way.w > bin.w || way.h > bin.h) {
          problemReason = 'no-panel-large-enough';
          problem = `the piece is larger than panel "${bin.panelId}"`;
        } else {
          problem = `placed around the kept feature, the piece would run off panel "${bin.panelId}"`;
        }
        continue;
      }
      const clash = placements.find((p) => p.bin === bin.index && overlaps(p, box));
      if (clash) {
        problem = `it would overlap the piece kept around feature "${model.pinned[clash.pinned].feature.id}"`;
        continue;
      }
      const candidate: PinnedPlacement = { ...box, pinned: index, bin: bin.index, rotated: way.rotated };
      const same = [...placements.filter((p) => p.bin === bin.index), candidate];
      const region: Box = { x: 0, y: 0, w: bin.w, h: bin.h };
      if (!separate(region, same.map((p) => ({ box: p, node: emptyNode(p.x, p.y, p.w, p.h) })))) {
        problem = 'with the other kept pieces in the panel it cannot be cut free by edge-to-edge cuts';
        continue;
      }
      placements.push(candidate);
      return;
    }
    fail(problemReason, problem);
  });
  return { placements, failures };
}

/** A bin's starting cut tree: its pinned pieces framed by cuts, the rest empty. */
export function skeletonTree(bin: BinModel, placements: PinnedPlacement[], first: FrameFirst = 'largest-free'): CutNode {
  const mine = placements.filter((p) => p.bin === bin.index);
  const region: Box = { x: 0, y: 0, w: bin.w, h: bin.h };
  const tree = separate(
    region,
    mine.map((p) => ({
      box: p,
      node: { kind: 'piece', x: p.x, y: p.y, w: p.w, h: p.h, type: -1, pinned: p.pinned, rotated: p.rotated },
    })),
    first,
  );
  // placePinnedPieces only keeps pieces that separate.
  return tree as CutNode;
}
