// An independent checker for cut plans, used by the specs only. It shares no
// code with the planner: it reads the input and the plan as plain JSON and
// does its own exact arithmetic with decimal.js, so a fault in the planner's
// step arithmetic or tree building cannot hide itself.
//
// It verifies: every placement lies inside its panel and obeys its source,
// size, turning and grain rules; no two placements overlap; each panel can be
// split recursively by full edge-to-edge cuts into exactly its pieces and
// waste; the printed cut sequence, replayed cut by cut, frees exactly the
// placed pieces; kept features lie whole inside their pieces; every copy is
// placed or reported short; every garment minimum is met or reported; the
// shortfall reasons are true; the totals add up.

import Decimal from 'decimal.js';
import type { CutPlan, CutPlanInput, PieceInput, Placement } from './cut-plan-types';

/** Largest amount a piece may be larger than asked (the planner's resolution). */
const ROUNDING = new Decimal('0.001');
/** How far a centred or offset piece may sit from exact (two rounding steps). */
const PLACE_TOLERANCE = new Decimal('0.002');
/**
 * Float noise the planner may ignore: a size within 1e-9 of a thousandth is
 * taken as that thousandth (6.499999999999999 as 6.5), so a piece may come
 * out this much smaller than asked.
 */
const NOISE = new Decimal('1e-9');

interface Box {
  x: Decimal;
  y: Decimal;
  w: Decimal;
  h: Decimal;
}

interface PanelFacts {
  kind: 'garment' | 'studio';
  garmentId?: string;
  width: Decimal;
  /** null for unlimited fabric. */
  height: Decimal | null;
  grain: string;
  directional: boolean;
}

const d = (n: number) => new Decimal(n);
const box = (r: { x: number; y: number; width: number; height: number }): Box => ({
  x: d(r.x),
  y: d(r.y),
  w: d(r.width),
  h: d(r.height),
});
const sameBox = (a: Box, b: Box) => a.x.eq(b.x) && a.y.eq(b.y) && a.w.eq(b.w) && a.h.eq(b.h);
const show = (b: Box) => `(${b.x}, ${b.y}) ${b.w} x ${b.h}`;

function overlap(a: Box, b: Box): boolean {
  return a.x.lt(b.x.plus(b.w)) && b.x.lt(a.x.plus(a.w)) && a.y.lt(b.y.plus(b.h)) && b.y.lt(a.y.plus(a.h));
}

/** True when the boxes in the region can be cut apart by full edge-to-edge cuts. */
export function guillotineSeparable(boxes: Box[]): boolean {
  if (boxes.length <= 1) return true;
  for (const axis of ['x', 'y'] as const) {
    const size = axis === 'x' ? 'w' : 'h';
    const sorted = [...boxes].sort((a, b) => a[axis].cmp(b[axis]));
    let reach = sorted[0][axis].plus(sorted[0][size]);
    for (let i = 1; i < sorted.length; i++) {
      if (reach.lte(sorted[i][axis])) {
        // A cut at `reach` runs clear of every box.
        return guillotineSeparable(sorted.slice(0, i)) && guillotineSeparable(sorted.slice(i));
      }
      reach = Decimal.max(reach, sorted[i][axis].plus(sorted[i][size]));
    }
  }
  return false;
}

function sourceOk(piece: PieceInput, panel: PanelFacts, panelId: string): boolean {
  const source = piece.source ?? { kind: 'any-garment' };
  switch (source.kind) {
    case 'any-garment':
      return panel.kind === 'garment';
    case 'garment':
      return panel.kind === 'garment' && panel.garmentId === source.garmentId;
    case 'garment-group':
      return panel.kind === 'garment' && source.garmentIds.includes(panel.garmentId as string);
    case 'studio-fabric':
      return panel.kind === 'studio' && panelId === source.fabricId;
  }
}

/** Ways a piece may lie in a panel by the turning rules: [unturned allowed, turned allowed]. */
function turnRules(piece: PieceInput, panel: PanelFacts): [boolean, boolean] {
  let unturned = true;
  let turned = piece.rotate !== false && !panel.directional;
  if (piece.grain === 'lengthwise') {
    if (panel.grain === 'along-height') turned = false;
    else if (panel.grain === 'along-width') unturned = false;
    else unturned = turned = false;
  }
  return [unturned, turned];
}

function fitsPanel(w: Decimal, h: Decimal, panel: PanelFacts): boolean {
  return w.lte(panel.width.plus(NOISE)) && (panel.height === null || h.lte(panel.height.plus(NOISE)));
}

/** Every rule the plan breaks, as sentences; an empty list means the plan is sound. */
export function checkPlan(input: CutPlanInput, plan: CutPlan): string[] {
  const faults: string[] = [];
  const panels = new Map<string, PanelFacts>();
  const features = new Map<string, { panelId: string; box: Box }>();
  for (const p of input.panels) {
    panels.set(p.panelId, {
      kind: 'garment',
      garmentId: p.garmentId,
      width: d(p.width),
      height: d(p.height),
      grain: p.grain ?? 'along-height',
      directional: p.directional === true,
    });
    for (const f of p.features ?? []) features.set(f.id, { panelId: p.panelId, box: box(f) });
  }
  for (const f of input.studioFabrics ?? []) {
    panels.set(f.fabricId, {
      kind: 'studio',
      width: d(f.width),
      height: f.length === 'unlimited' ? null : d(f.length),
      grain: 'along-height',
      directional: f.directional === true,
    });
  }
  const pieces = new Map(input.pieces.map((p) => [p.id, p]));

  // Placements, one by one.
  const byPanel = new Map<string, Placement[]>();
  for (const pl of plan.placements) {
    const name = `${pl.pieceId} #${pl.copy} in ${pl.panelId}`;
    const piece = pieces.get(pl.pieceId);
    const panel = panels.get(pl.panelId);
    if (!piece || !panel) {
      faults.push(`${name}: unknown piece or panel`);
      continue;
    }
    if (!byPanel.has(pl.panelId)) byPanel.set(pl.panelId, []);
    byPanel.get(pl.panelId)?.push(pl);
    if (panel.kind === 'garment' && pl.garmentId !== panel.garmentId) faults.push(`${name}: wrong garment id`);
    if (!sourceOk(piece, panel, pl.panelId)) faults.push(`${name}: its source rule does not allow this panel`);
    const b = box(pl);
    const [askW, askH] = pl.rotated ? [d(piece.height), d(piece.width)] : [d(piece.width), d(piece.height)];
    if (b.w.lt(askW.minus(NOISE)) || b.h.lt(askH.minus(NOISE)) || b.w.minus(askW).gt(ROUNDING) || b.h.minus(askH).gt(ROUNDING)) {
      faults.push(`${name}: size ${b.w} x ${b.h} is not the piece's ${askW} x ${askH}`);
    }
    const [unturned, turned] = turnRules(piece, panel);
    const allowed = pl.rotated ? turned : unturned;
    if (!allowed) faults.push(`${name}: ${pl.rotated ? 'turned' : 'unturned'} breaks the turning or grain rules`);
    if (b.x.lt(0) || b.y.lt(0) || !fitsPanel(b.x.plus(b.w), b.y.plus(b.h), panel)) {
      faults.push(`${name}: ${show(b)} runs off the panel`);
    }
    if (piece.keptFeature) {
      const feature = features.get(piece.keptFeature.featureId);
      if (!feature || pl.featureId !== piece.keptFeature.featureId || feature.panelId !== pl.panelId) {
        faults.push(`${name}: not placed on its kept feature`);
      } else {
        const f = feature.box;
        const inside =
          b.x.lte(f.x) && b.y.lte(f.y) && b.x.plus(b.w).gte(f.x.plus(f.w)) && b.y.plus(b.h).gte(f.y.plus(f.h));
        if (!inside) faults.push(`${name}: kept feature ${show(f)} is not whole inside ${show(b)}`);
        const placement = piece.keptFeature.placement;
        if (placement === 'centred') {
          const off = (a: Decimal, aw: Decimal, c: Decimal, cw: Decimal) =>
            a.times(2).plus(aw).minus(c.times(2)).minus(cw).abs().div(2);
          if (off(b.x, b.w, f.x, f.w).gt(PLACE_TOLERANCE) || off(b.y, b.h, f.y, f.h).gt(PLACE_TOLERANCE)) {
            faults.push(`${name}: not centred on its kept feature`);
          }
        } else if (
          f.x.minus(b.x).minus(placement.x).abs().gt(PLACE_TOLERANCE) ||
          f.y.minus(b.y).minus(placement.y).abs().gt(PLACE_TOLERANCE) ||
          pl.rotated
        ) {
          faults.push(`${name}: not at its kept feature's offset`);
        }
      }
    } else if (pl.featureId !== undefined) {
      faults.push(`${name}: claims a kept feature the piece does not have`);
    }
  }

  // Panels: overlaps, guillotine cuts, the cut sequence and the summary.
  for (const pp of plan.panels) {
    const facts = panels.get(pp.panelId);
    if (!facts) {
      faults.push(`panel ${pp.panelId}: not in the input`);
      continue;
    }
    const placed = byPanel.get(pp.panelId) ?? [];
    const boxes = placed.map(box);
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        if (overlap(boxes[i], boxes[j])) faults.push(`panel ${pp.panelId}: ${show(boxes[i])} overlaps ${show(boxes[j])}`);
      }
    }
    if (!guillotineSeparable(boxes)) faults.push(`panel ${pp.panelId}: the pieces cannot be cut apart edge to edge`);
    if (pp.piecesCut !== placed.length) faults.push(`panel ${pp.panelId}: piecesCut ${pp.piecesCut}, placed ${placed.length}`);
    const usedArea = placed.reduce((s, pl) => {
      const piece = pieces.get(pl.pieceId) as PieceInput;
      return s.plus(d(piece.width).times(piece.height));
    }, new Decimal(0));
    const panelArea = d(pp.width).times(pp.height);
    if (usedArea.gt(panelArea.plus(NOISE.times(placed.length + 1).times(pp.width + pp.height)))) faults.push(`panel ${pp.panelId}: pieces' area ${usedArea} exceeds the panel's ${panelArea}`);
    if (usedArea.minus(pp.areaUsed).abs().gt(1e-6)) faults.push(`panel ${pp.panelId}: areaUsed ${pp.areaUsed} is not ${usedArea}`);
    faults.push(...replayCuts(pp, facts, placed));
  }

  // Every copy placed or short, each copy once.
  const shortOf = new Map<string, number>();
  for (const s of plan.shortfall.pieces) shortOf.set(s.pieceId, (shortOf.get(s.pieceId) ?? 0) + s.count);
  for (const piece of input.pieces) {
    const mine = plan.placements.filter((p) => p.pieceId === piece.id);
    const copies = new Set(mine.map((p) => p.copy));
    if (copies.size !== mine.length) faults.push(`piece ${piece.id}: a copy number is used twice`);
    if (mine.length + (shortOf.get(piece.id) ?? 0) !== piece.count) {
      faults.push(`piece ${piece.id}: ${mine.length} placed + ${shortOf.get(piece.id) ?? 0} short != ${piece.count}`);
    }
  }
  for (const s of plan.shortfall.pieces) {
    const piece = pieces.get(s.pieceId);
    if (!piece) continue;
    faults.push(...checkReason(piece, s.reason, panels));
  }

  // Garment minimums met or reported.
  for (const minimum of input.rules?.garmentMinimums ?? []) {
    const got = plan.placements.filter((p) => p.garmentId === minimum.garmentId).length;
    if (got >= minimum.count) continue;
    const reported = plan.shortfall.garmentMinimums.find((m) => m.garmentId === minimum.garmentId);
    if (!reported || reported.achieved !== got || reported.required < minimum.count) {
      faults.push(`garment ${minimum.garmentId}: ${got} of ${minimum.count} pieces and not reported`);
    }
  }

  if (plan.totals.piecesPlaced !== plan.placements.length) faults.push('totals: piecesPlaced is wrong');
  const requested = input.pieces.reduce((s, p) => s + p.count, 0);
  if (plan.totals.piecesRequested !== requested) faults.push('totals: piecesRequested is wrong');
  return faults;
}

/** Checks a short piece's reason against the panels it may come from. */
function checkReason(piece: PieceInput, reason: string, panels: Map<string, PanelFacts>): string[] {
  if (piece.keptFeature) return [];
  const eligible = [...panels.entries()].filter(([id, p]) => sourceOk(piece, p, id)).map(([, p]) => p);
  const w = d(piece.width);
  const h = d(piece.height);
  const fitsAnyWay = eligible.some((p) => fitsPanel(w, h, p) || fitsPanel(h, w, p));
  const fitsAllowed = eligible.some((p) => {
    const [unturned, turned] = turnRules(piece, p);
    return (unturned && fitsPanel(w, h, p)) || (turned && fitsPanel(h, w, p));
  });
  const expected =
    eligible.length === 0 ? 'rule-not-met' : !fitsAnyWay ? 'no-panel-large-enough' : !fitsAllowed ? 'rule-not-met' : 'not-enough-area';
  return expected === reason ? [] : [`piece ${piece.id}: reported short for ${reason}, but the reason is ${expected}`];
}

/**
 * Replays a panel's cut sequence from the whole (usable) panel: each cut must
 * cut a region that exists, straight across it; at the end the regions that
 * are pieces must be exactly the panel's placements.
 */
function replayCuts(pp: CutPlan['panels'][number], facts: PanelFacts, placed: Placement[]): string[] {
  const faults: string[] = [];
  const name = `panel ${pp.panelId}`;
  const usable: Box = { x: d(0), y: d(0), w: d(pp.usableWidth), h: d(pp.usableHeight) };
  if (usable.w.gt(facts.width.plus(NOISE)) || facts.width.minus(usable.w).gte(ROUNDING)) faults.push(`${name}: usable width is off`);
  if (facts.height !== null && (usable.h.gt(facts.height.plus(NOISE)) || facts.height.minus(usable.h).gte(ROUNDING))) {
    faults.push(`${name}: usable height is off`);
  }
  const regions: { box: Box; content: string; pieceId?: string; copy?: number }[] = [{ box: usable, content: 'panel' }];
  for (const step of pp.cuts) {
    const at = regions.findIndex((r) => sameBox(r.box, box(step.regionRect)));
    if (at < 0) {
      faults.push(`${name}, step ${step.step}: cuts a region that is not there`);
      return faults;
    }
    const r = regions[at].box;
    const cut = d(step.at);
    const horizontal = step.direction === 'horizontal';
    const span = horizontal ? r.h : r.w;
    if (cut.lte(0) || cut.gte(span)) {
      faults.push(`${name}, step ${step.step}: cut at ${cut} is outside the region`);
      return faults;
    }
    if (!d(step.length).eq(horizontal ? r.w : r.h)) faults.push(`${name}, step ${step.step}: cut is not edge to edge`);
    const off: Box = horizontal ? { ...r, h: cut } : { ...r, w: cut };
    const rest: Box = horizontal ? { ...r, y: r.y.plus(cut), h: r.h.minus(cut) } : { ...r, x: r.x.plus(cut), w: r.w.minus(cut) };
    if (!sameBox(off, box(step.cutsOff)) || !sameBox(rest, box(step.remaining))) {
      faults.push(`${name}, step ${step.step}: the parts are not what the cut makes`);
    }
    regions.splice(
      at,
      1,
      { box: off, content: step.cutsOff.content, pieceId: step.cutsOff.pieceId, copy: step.cutsOff.copy },
      { box: rest, content: step.remaining.content, pieceId: step.remaining.pieceId, copy: step.remaining.copy },
    );
  }
  const pieceRegions = regions.filter((r) => r.content === 'piece');
  if (pp.cuts.length === 0 && placed.length === 1) {
    // One piece the size of the whole panel needs no cut.
    if (!sameBox(usable, box(placed[0]))) faults.push(`${name}: no cuts, but the piece is not the whole panel`);
    return faults;
  }
  if (pieceRegions.length !== placed.length) {
    faults.push(`${name}: the cuts free ${pieceRegions.length} pieces, the plan places ${placed.length}`);
  }
  for (const pl of placed) {
    const match = pieceRegions.find((r) => r.pieceId === pl.pieceId && r.copy === pl.copy);
    if (!match || !sameBox(match.box, box(pl))) faults.push(`${name}: the cuts do not free ${pl.pieceId} #${pl.copy} where it is placed`);
  }
  for (const r of regions) {
    if (r.content === 'strip') faults.push(`${name}: region ${show(r.box)} is left as a strip with no cuts`);
  }
  return faults;
}
