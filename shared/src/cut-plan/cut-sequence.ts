// The cut sequence: a panel's cut tree written out as the passes of the
// rotary cutter, in the order the maker makes them. First the cuts in the
// whole panel (the strips), then the sub-cuts of each strip in turn, then any
// further trims. Each cut runs straight from edge to edge of the region it is
// made in, and is measured from that region's top or left edge.

import type { CutRegion, CutStep, PlanRect, RegionContent } from './cut-plan-types';
import type { CutNode, EmptyNode, PieceNode, SplitNode } from './guillotine-packer';
import { SCALE } from './scaled-units';

// Read once: a module binding read in a hot loop can cost a getter call per read.
const PER_UNIT = SCALE;
const fromSteps = (steps: number) => steps / PER_UNIT;

/**
 * The same tree in its plainest form: parallel cuts in one region gathered
 * into one split, neighbouring empty parts joined (no cut between them), and
 * splits of a single part removed.
 */
export function normalizeTree(node: CutNode): CutNode {
  if (node.kind !== 'split') return node;
  const parts: CutNode[] = [];
  for (const child of node.children) {
    const plain = normalizeTree(child);
    if (plain.kind === 'split' && plain.dir === node.dir) {
      for (const grandchild of plain.children) appendPart(parts, grandchild, node.dir);
    } else {
      appendPart(parts, plain, node.dir);
    }
  }
  if (parts.length === 1) {
    const only = parts[0];
    return only.kind === 'empty' ? { kind: 'empty', x: node.x, y: node.y, w: node.w, h: node.h } : only;
  }
  return { kind: 'split', dir: node.dir, x: node.x, y: node.y, w: node.w, h: node.h, children: parts };
}

/** Appends a part to a split's parts, joining it to an empty neighbour when both are empty. */
function appendPart(parts: CutNode[], child: CutNode, dir: 'h' | 'v'): void {
  const last = parts.length > 0 ? parts[parts.length - 1] : undefined;
  if (child.kind === 'empty' && last?.kind === 'empty') {
    parts[parts.length - 1] =
      dir === 'h'
        ? { kind: 'empty', x: last.x, y: last.y, w: last.w, h: last.h + child.h }
        : { kind: 'empty', x: last.x, y: last.y, w: last.w + child.w, h: last.h };
  } else {
    parts.push(child);
  }
}

/**
 * Cuts an unlimited-length tree at the end of its last strip: what is below
 * is the rest of the bolt, not part of the plan. Returns the trimmed tree and
 * the length used, in steps.
 */
export function trimUnbounded(node: CutNode): { tree: CutNode | null; length: number } {
  if (node.kind === 'empty') return { tree: null, length: 0 };
  if (node.kind === 'split' && node.dir === 'h') {
    const last = node.children[node.children.length - 1];
    if (last.kind === 'empty' && last.h === Infinity) {
      const kept = node.children.slice(0, -1);
      const length = last.y - node.y;
      const tree = kept.length === 1 ? kept[0] : { ...node, h: length, children: kept };
      return { tree, length };
    }
  }
  return { tree: node, length: node.h };
}

export interface SequenceOptions {
  /** Names the piece a piece node is (its id and copy number). */
  describe: (node: PieceNode) => { pieceId: string; copy: number };
  /** Smallest offcut worth keeping, in steps; leftovers smaller are waste. */
  minimumOffcut?: { w: number; h: number };
}

function isOffcut(node: EmptyNode, minimum?: { w: number; h: number }): boolean {
  if (!minimum) return false;
  return (node.w >= minimum.w && node.h >= minimum.h) || (node.w >= minimum.h && node.h >= minimum.w);
}

function rect(x: number, y: number, w: number, h: number): PlanRect {
  return { x: fromSteps(x), y: fromSteps(y), width: fromSteps(w), height: fromSteps(h) };
}

function describeRegion(node: CutNode, label: string, options: SequenceOptions): CutRegion {
  const x = fromSteps(node.x);
  const y = fromSteps(node.y);
  const width = fromSteps(node.w);
  const height = fromSteps(node.h);
  if (node.kind === 'piece') {
    const named = options.describe(node);
    return { label, content: 'piece', x, y, width, height, pieceId: named.pieceId, copy: named.copy };
  }
  const content: RegionContent =
    node.kind === 'split' ? 'strip' : isOffcut(node, options.minimumOffcut) ? 'offcut' : 'waste';
  return { label, content, x, y, width, height };
}

function collectOffcuts(node: CutNode, minimum: { w: number; h: number } | undefined, out: PlanRect[]): void {
  if (node.kind === 'empty' && isOffcut(node, minimum)) out.push(rect(node.x, node.y, node.w, node.h));
  if (node.kind === 'split') for (const child of node.children) collectOffcuts(child, minimum, out);
}

const childLabel = (parent: string, i: number) => (parent === 'panel' ? `${i + 1}` : `${parent}.${i + 1}`);

/** The cut steps and kept offcuts of a (normalized) tree, in the caller's unit. */
export function cutSequence(tree: CutNode | null, options: SequenceOptions): { cuts: CutStep[]; offcuts: PlanRect[] } {
  const cuts: CutStep[] = [];
  const offcuts: PlanRect[] = [];
  if (!tree) return { cuts, offcuts };
  collectOffcuts(tree, options.minimumOffcut, offcuts);

  // Breadth first: every cut of one stage before the next stage.
  let level: { node: SplitNode; label: string }[] = tree.kind === 'split' ? [{ node: tree, label: 'panel' }] : [];
  let stage = 1;
  while (level.length > 0) {
    const next: { node: SplitNode; label: string }[] = [];
    for (const { node, label } of level) {
      let x = node.x;
      let y = node.y;
      let w = node.w;
      let h = node.h;
      const horizontal = node.dir === 'h';
      const last = node.children.length - 1;
      for (let i = 0; i <= last; i++) {
        const child = node.children[i];
        if (child.kind === 'split') next.push({ node: child, label: childLabel(label, i) });
        if (i === last) break;
        const at = horizontal ? child.h : child.w;
        const restX = horizontal ? x : x + at;
        const restY = horizontal ? y + at : y;
        const restW = horizontal ? w : w - at;
        const restH = horizontal ? h - at : h;
        const remaining: CutRegion =
          i === last - 1
            ? describeRegion(node.children[i + 1], childLabel(label, i + 1), options)
            : {
                label,
                content: 'strip',
                x: fromSteps(restX),
                y: fromSteps(restY),
                width: fromSteps(restW),
                height: fromSteps(restH),
              };
        cuts.push({
          step: cuts.length + 1,
          stage,
          region: label,
          regionRect: rect(x, y, w, h),
          direction: horizontal ? 'horizontal' : 'vertical',
          at: fromSteps(at),
          length: fromSteps(horizontal ? w : h),
          cutsOff: describeRegion(child, childLabel(label, i), options),
          remaining,
        });
        x = restX;
        y = restY;
        w = restW;
        h = restH;
      }
    }
    level = next;
    stage++;
  }
  return { cuts, offcuts };
}
