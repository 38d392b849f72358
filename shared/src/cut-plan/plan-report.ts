// The plan as the app sees it: placements, each panel's cut sequence,
// offcuts and yield, per-garment and per-fabric figures, shortfall and
// totals, all in the caller's unit and plain JSON.

import type {
  CutPlan,
  GarmentSummary,
  PanelPlan,
  Placement,
  StudioFabricSummary,
} from './cut-plan-types';
import { cutSequence, normalizeTree, trimUnbounded } from './cut-sequence';
import type { CutNode, PieceNode } from './guillotine-packer';
import type { PlanModel } from './plan-model';
import type { PlanState } from './plan-search';
import { SCALE } from './scaled-units';
import { extraLength, garmentMinimumShortfalls, pieceShortfalls } from './shortfall';

function pieceNodes(node: CutNode, out: PieceNode[] = []): PieceNode[] {
  if (node.kind === 'piece') out.push(node);
  else if (node.kind === 'split') for (const child of node.children) pieceNodes(child, out);
  return out;
}

const ratio = (part: number, whole: number) => (whole > 0 ? part / whole : 0);
// Read once: a module binding read in a loop can cost a getter call per read.
const PER_UNIT = SCALE;
const fromSteps = (steps: number) => steps / PER_UNIT;

/** Writes the chosen plan out. */
export function reportPlan(model: PlanModel, state: PlanState): CutPlan {
  const { bins, types, pieces } = model;
  const placedCopies = new Int32Array(pieces.length);
  // Each type hands out its members' ids in input order.
  const cursor = types.map(() => ({ member: 0, used: 0 }));
  const named = new Map<PieceNode, { piece: number; copy: number }>();
  const nameNode = (node: PieceNode) => {
    let piece: number;
    if (node.pinned >= 0) {
      piece = model.pinned[node.pinned].piece;
    } else {
      const type = types[node.type];
      const c = cursor[node.type];
      while (c.used >= type.members[c.member].count) {
        c.member++;
        c.used = 0;
      }
      c.used++;
      piece = type.members[c.member].piece;
    }
    placedCopies[piece]++;
    named.set(node, { piece, copy: placedCopies[piece] });
  };

  const sequenceOptions = {
    describe: (node: PieceNode) => {
      const n = named.get(node) as { piece: number; copy: number };
      return { pieceId: pieces[n.piece].id, copy: n.copy };
    },
    minimumOffcut: model.minimumOffcut,
  };
  const placements: Placement[] = [];
  const panels: PanelPlan[] = [];
  const pieceArea = (piece: number) => pieces[piece].width * pieces[piece].height;
  const binUsed: number[] = [];
  const binArea: number[] = [];
  const binLength: number[] = [];

  for (const bin of bins) {
    let tree: CutNode | null = normalizeTree(state.trees[bin.index]);
    let heightSteps = bin.h;
    if (bin.unbounded) {
      const trimmed = trimUnbounded(tree);
      tree = trimmed.tree;
      heightSteps = trimmed.length;
    }
    const nodes = tree ? pieceNodes(tree) : [];
    let areaUsed = 0;
    for (const node of nodes) {
      nameNode(node);
      const { piece, copy } = named.get(node) as { piece: number; copy: number };
      areaUsed += pieceArea(piece);
      const placement: Placement = {
        pieceId: pieces[piece].id,
        copy,
        panelId: bin.panelId,
        x: fromSteps(node.x),
        y: fromSteps(node.y),
        width: fromSteps(node.w),
        height: fromSteps(node.h),
        rotated: node.rotated,
      };
      if (bin.kind === 'garment') placement.garmentId = bin.garmentId;
      else placement.fabricId = bin.fabricId;
      if (node.pinned >= 0) placement.featureId = model.pinned[node.pinned].feature.id;
      placements.push(placement);
    }
    const { cuts, offcuts } = cutSequence(tree, sequenceOptions);
    const height = bin.unbounded ? fromSteps(heightSteps) : bin.height;
    const area = bin.width * height;
    binUsed.push(areaUsed);
    binArea.push(area);
    binLength.push(heightSteps);
    const panel: PanelPlan = {
      panelId: bin.panelId,
      kind: bin.kind,
      width: bin.width,
      height,
      usableWidth: fromSteps(bin.w),
      usableHeight: fromSteps(heightSteps),
      piecesCut: nodes.length,
      area,
      areaUsed,
      yield: ratio(areaUsed, area),
      offcuts,
      cuts,
    };
    if (bin.kind === 'garment') panel.garmentId = bin.garmentId;
    else panel.fabricId = bin.fabricId;
    panels.push(panel);
  }

  const minimumOf = new Map(model.garments.map((g) => [g.id, g.minimum]));
  const garments: GarmentSummary[] = model.garments.map((g) => {
    const area = g.bins.reduce((s, b) => s + binArea[b], 0);
    const areaUsed = g.bins.reduce((s, b) => s + binUsed[b], 0);
    const summary: GarmentSummary = {
      garmentId: g.id,
      panels: g.bins.length,
      piecesCut: g.bins.reduce((s, b) => s + panels[b].piecesCut, 0),
      area,
      areaUsed,
      yield: ratio(areaUsed, area),
    };
    const minimum = minimumOf.get(g.id) ?? 0;
    if (minimum > 0) summary.minimum = minimum;
    return summary;
  });

  // Copies left over, per piece, in each type's member order.
  const short = new Map<number, { count: number; type: number }>();
  for (const type of types) {
    for (const member of type.members) {
      const left = pieces[member.piece].count - placedCopies[member.piece];
      if (left > 0) short.set(member.piece, { count: left, type: type.index });
    }
  }

  const studioFabrics: StudioFabricSummary[] = bins
    .filter((b) => b.kind === 'studio')
    .map((bin) => {
      const summary: StudioFabricSummary = {
        fabricId: bin.fabricId as string,
        width: bin.width,
        lengthAvailable: bin.lengthAvailable as number | 'unlimited',
        lengthUsed: fromSteps(lengthUsed(state.trees[bin.index], binLength[bin.index], bin.unbounded)),
        piecesCut: panels[bin.index].piecesCut,
        areaUsed: binUsed[bin.index],
      };
      const shortHere = [...short.values()].filter((s) => {
        const source = types[s.type].source;
        return source.kind === 'studio-fabric' && source.fabricId === bin.fabricId;
      });
      if (!bin.unbounded && shortHere.length > 0) {
        const length = extraLength(model, bin, shortHere);
        if (length !== null) summary.extraLengthNeeded = fromSteps(length);
      }
      return summary;
    });

  const piecesRequested = pieces.reduce((s, p) => s + p.count, 0);
  const areaRequested = pieces.reduce((s, p) => s + p.count * p.width * p.height, 0);
  const garmentArea = garments.reduce((s, g) => s + g.area, 0);
  const garmentAreaUsed = garments.reduce((s, g) => s + g.areaUsed, 0);
  const fabricArea = binArea.reduce((s, a) => s + a, 0);
  const areaPlaced = binUsed.reduce((s, a) => s + a, 0);

  return {
    unit: model.unit,
    resolution: fromSteps(1),
    placements,
    panels,
    garments,
    studioFabrics,
    shortfall: {
      pieces: pieceShortfalls(model, short, state.pinnedFailures),
      garmentMinimums: garmentMinimumShortfalls(model, state.binPieces, state.counts, state.trees),
    },
    totals: {
      piecesRequested,
      piecesPlaced: placements.length,
      piecesShort: piecesRequested - placements.length,
      areaRequested,
      areaPlaced,
      garmentArea,
      garmentAreaUsed,
      garmentYield: ratio(garmentAreaUsed, garmentArea),
      fabricArea,
      yield: ratio(areaPlaced, fabricArea),
    },
    strategy: state.strategy,
  };
}

/** Distance from the top of a bin to the bottom of its lowest piece or cut, in steps. */
function lengthUsed(tree: CutNode, trimmedLength: number, unbounded: boolean): number {
  if (unbounded) return trimmedLength;
  let lowest = 0;
  for (const node of pieceNodes(tree)) lowest = Math.max(lowest, node.y + node.h);
  return lowest;
}
