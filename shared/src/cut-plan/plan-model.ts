// The planner's working model of an input: sizes in whole steps (see
// scaled-units.ts), every garment panel and studio fabric as a "bin", every
// run of interchangeable pieces as one "piece type" with a count, and for each
// bin the orientations in which each type may lie there.

import type {
  CutPlanInput,
  GrainDirection,
  KeptFeaturePin,
  PieceInput,
  PieceSource,
} from './cut-plan-types';
import { CutPlanInputError } from './cut-plan-input-error';
import { stepsDown, stepsUp } from './scaled-units';

/** Largest length accepted, in the caller's unit: keeps every area exact in a double. */
export const MAX_LENGTH = 50_000;

export interface FeatureModel {
  id: string;
  bin: number;
  /** Rounded outward, so a piece holding these steps holds the feature as given. */
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface BinModel {
  index: number;
  panelId: string;
  kind: 'garment' | 'studio';
  garmentId?: string;
  fabricId?: string;
  /** Steps, rounded down. For unlimited fabric h is Infinity. */
  w: number;
  h: number;
  unbounded: boolean;
  grain: GrainDirection;
  directional: boolean;
  /** As given, in the caller's unit (height NaN for unlimited fabric). */
  width: number;
  height: number;
  lengthAvailable?: number | 'unlimited';
  features: FeatureModel[];
}

/** Interchangeable copies: same size, source rule, grain and turning rules. */
export interface PieceTypeModel {
  index: number;
  /** Steps, rounded up, unturned. */
  w: number;
  h: number;
  rotate: boolean;
  lengthwise: boolean;
  source: PieceSource;
  restricted: boolean;
  /** Bins the source rule allows (size not yet considered). */
  sourceBins: number[];
  /** Pieces merged into this type, in input order, with their counts. */
  members: { piece: number; count: number }[];
  count: number;
}

/** A way a piece type may lie in a bin. */
export interface Orientation {
  type: number;
  w: number;
  h: number;
  rotated: boolean;
  /** w * h in square steps. */
  area: number;
}

export interface PinnedPieceModel {
  piece: number;
  feature: FeatureModel;
  pin: KeptFeaturePin;
  w: number;
  h: number;
  rotate: boolean;
  lengthwise: boolean;
  source: PieceSource;
}

export interface GarmentModel {
  id: string;
  bins: number[];
  minimum: number;
}

export interface PlanModel {
  unit: string;
  input: CutPlanInput;
  pieces: PieceInput[];
  bins: BinModel[];
  types: PieceTypeModel[];
  pinned: PinnedPieceModel[];
  garments: GarmentModel[];
  /** Garment ids named by a minimum but with no panels. */
  minimumsWithoutPanels: { garmentId: string; count: number }[];
  /** Per bin, every orientation of every type allowed there that fits the bin. */
  binOptions: Orientation[][];
  minimumOffcut?: { w: number; h: number };
}

const GRAINS: readonly GrainDirection[] = ['along-height', 'along-width', 'unknown'];

/** Which of a piece's two ways round it may lie in a bin, by the turning and grain rules. */
export function allowedTurns(
  piece: { rotate: boolean; lengthwise: boolean },
  bin: { grain: GrainDirection; directional: boolean },
): { unturned: boolean; turned: boolean } {
  let unturned = true;
  let turned = piece.rotate && !bin.directional;
  if (piece.lengthwise) {
    // The piece's height must run along the lengthwise grain.
    if (bin.grain === 'along-height') turned = false;
    else if (bin.grain === 'along-width') unturned = false;
    else unturned = turned = false;
  }
  return { unturned, turned };
}

/** True when the source rule lets a piece come from the bin. */
export function sourceAllows(source: PieceSource, bin: BinModel): boolean {
  switch (source.kind) {
    case 'any-garment':
      return bin.kind === 'garment';
    case 'garment':
      return bin.kind === 'garment' && bin.garmentId === source.garmentId;
    case 'garment-group':
      return bin.kind === 'garment' && source.garmentIds.includes(bin.garmentId ?? '');
    case 'studio-fabric':
      return bin.kind === 'studio' && bin.fabricId === source.fabricId;
  }
}

/** Orientations of a w x h piece allowed in and fitting the bin (a square once only). */
export function orientationsIn(
  piece: { w: number; h: number; rotate: boolean; lengthwise: boolean },
  bin: BinModel,
  type = -1,
): Orientation[] {
  const turns = allowedTurns(piece, bin);
  const out: Orientation[] = [];
  const area = piece.w * piece.h;
  if (turns.unturned && piece.w <= bin.w && piece.h <= bin.h) {
    out.push({ type, w: piece.w, h: piece.h, rotated: false, area });
  }
  const square = piece.w === piece.h;
  if (turns.turned && piece.h <= bin.w && piece.w <= bin.h && !(square && out.length > 0)) {
    out.push({ type, w: piece.h, h: piece.w, rotated: true, area });
  }
  return out;
}

function sourceKey(source: PieceSource): string {
  switch (source.kind) {
    case 'any-garment':
      return 'any';
    case 'garment':
      return `g:${source.garmentId}`;
    case 'garment-group':
      return `group:${[...source.garmentIds].sort().join('\u0000')}`;
    case 'studio-fabric':
      return `studio:${source.fabricId}`;
  }
}

function isLength(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value > 0 && value <= MAX_LENGTH;
}

function isText(value: unknown): value is string {
  return typeof value === 'string' && value.length > 0;
}

/** Checks the input and builds the model; throws CutPlanInputError listing every fault. */
export function buildPlanModel(input: CutPlanInput): PlanModel {
  const problems: string[] = [];
  const lengthProblem = (what: string) =>
    problems.push(`${what} must be a number above 0 and at most ${MAX_LENGTH}`);

  const panels = Array.isArray(input?.panels) ? input.panels : [];
  const fabrics = Array.isArray(input?.studioFabrics) ? input.studioFabrics : [];
  const pieces = Array.isArray(input?.pieces) ? input.pieces : [];
  if (!Array.isArray(input?.panels)) problems.push('panels must be a list');
  if (!Array.isArray(input?.pieces)) problems.push('pieces must be a list');

  const bins: BinModel[] = [];
  const binIds = new Set<string>();
  const features = new Map<string, FeatureModel>();
  for (const [i, panel] of panels.entries()) {
    const name = `panel ${isText(panel?.panelId) ? `"${panel.panelId}"` : i + 1}`;
    if (!isText(panel?.panelId)) problems.push(`${name}: panelId must be a non-empty text`);
    else if (binIds.has(panel.panelId)) problems.push(`${name}: the id is used twice`);
    if (!isText(panel?.garmentId)) problems.push(`${name}: garmentId must be a non-empty text`);
    if (!isLength(panel?.width)) lengthProblem(`${name}: width`);
    if (!isLength(panel?.height)) lengthProblem(`${name}: height`);
    const grain = panel?.grain ?? 'along-height';
    if (!GRAINS.includes(grain)) problems.push(`${name}: grain must be one of ${GRAINS.join(', ')}`);
    binIds.add(panel?.panelId);
    const bin: BinModel = {
      index: bins.length,
      panelId: panel?.panelId,
      kind: 'garment',
      garmentId: panel?.garmentId,
      w: stepsDown(panel?.width),
      h: stepsDown(panel?.height),
      unbounded: false,
      grain,
      directional: panel?.directional === true,
      width: panel?.width,
      height: panel?.height,
      features: [],
    };
    for (const [j, feature] of (Array.isArray(panel?.features) ? panel.features : []).entries()) {
      const fname = `${name}, feature ${isText(feature?.id) ? `"${feature.id}"` : j + 1}`;
      if (!isText(feature?.id)) problems.push(`${fname}: id must be a non-empty text`);
      else if (features.has(feature.id)) problems.push(`${fname}: the id is used twice`);
      if (!isLength(feature?.width)) lengthProblem(`${fname}: width`);
      if (!isLength(feature?.height)) lengthProblem(`${fname}: height`);
      const inside =
        typeof feature?.x === 'number' &&
        typeof feature?.y === 'number' &&
        feature.x >= 0 &&
        feature.y >= 0 &&
        feature.x + feature.width <= panel?.width &&
        feature.y + feature.height <= panel?.height;
      if (!inside) problems.push(`${fname}: must lie inside the panel (x, y from its top-left corner)`);
      const model: FeatureModel = {
        id: feature?.id,
        bin: bin.index,
        x: stepsDown(feature?.x),
        y: stepsDown(feature?.y),
        w: stepsUp(feature?.x + feature?.width) - stepsDown(feature?.x),
        h: stepsUp(feature?.y + feature?.height) - stepsDown(feature?.y),
      };
      features.set(feature?.id, model);
      bin.features.push(model);
    }
    bins.push(bin);
  }
  for (const [i, fabric] of fabrics.entries()) {
    const name = `studio fabric ${isText(fabric?.fabricId) ? `"${fabric.fabricId}"` : i + 1}`;
    if (!isText(fabric?.fabricId)) problems.push(`${name}: fabricId must be a non-empty text`);
    else if (binIds.has(fabric.fabricId)) problems.push(`${name}: the id is used twice`);
    binIds.add(fabric?.fabricId);
    if (!isLength(fabric?.width)) lengthProblem(`${name}: width`);
    const unbounded = fabric?.length === 'unlimited';
    if (!unbounded && !isLength(fabric?.length)) lengthProblem(`${name}: length (or 'unlimited')`);
    bins.push({
      index: bins.length,
      panelId: fabric?.fabricId,
      kind: 'studio',
      fabricId: fabric?.fabricId,
      w: stepsDown(fabric?.width),
      h: unbounded ? Infinity : stepsDown(fabric?.length as number),
      unbounded,
      grain: 'along-height',
      directional: fabric?.directional === true,
      width: fabric?.width,
      height: unbounded ? NaN : (fabric?.length as number),
      lengthAvailable: fabric?.length,
      features: [],
    });
  }

  const pieceIds = new Set<string>();
  for (const [i, piece] of pieces.entries()) {
    const name = `piece ${isText(piece?.id) ? `"${piece.id}"` : i + 1}`;
    if (!isText(piece?.id)) problems.push(`${name}: id must be a non-empty text`);
    else if (pieceIds.has(piece.id)) problems.push(`${name}: the id is used twice`);
    pieceIds.add(piece?.id);
    if (!isLength(piece?.width)) lengthProblem(`${name}: width`);
    if (!isLength(piece?.height)) lengthProblem(`${name}: height`);
    if (!Number.isInteger(piece?.count) || piece.count < 0 || piece.count > 1_000_000) {
      problems.push(`${name}: count must be a whole number from 0 to 1000000`);
    }
    if (piece?.grain !== undefined && piece.grain !== 'lengthwise' && piece.grain !== 'any') {
      problems.push(`${name}: grain must be 'lengthwise' or 'any'`);
    }
    const source = piece?.source;
    if (source !== undefined) {
      const ok =
        source.kind === 'any-garment' ||
        (source.kind === 'garment' && isText(source.garmentId)) ||
        (source.kind === 'garment-group' &&
          Array.isArray(source.garmentIds) &&
          source.garmentIds.every(isText)) ||
        (source.kind === 'studio-fabric' && isText(source.fabricId));
      if (!ok) problems.push(`${name}: source is not a known kind of rule`);
    }
    const pin = piece?.keptFeature;
    if (pin !== undefined) {
      if (!features.has(pin.featureId)) problems.push(`${name}: kept feature "${pin.featureId}" is not on any panel`);
      if (piece.count > 1) problems.push(`${name}: a piece kept around a feature must have count 1`);
      const offset = pin.placement;
      const offsetOk =
        offset === 'centred' ||
        (typeof offset === 'object' &&
          offset !== null &&
          Number.isFinite(offset.x) &&
          Number.isFinite(offset.y) &&
          offset.x >= 0 &&
          offset.y >= 0);
      if (!offsetOk) problems.push(`${name}: kept feature placement must be 'centred' or an offset { x, y } of 0 or more`);
    }
  }

  const minimums = input?.rules?.garmentMinimums ?? [];
  if (!Array.isArray(minimums)) problems.push('rules.garmentMinimums must be a list');
  for (const minimum of Array.isArray(minimums) ? minimums : []) {
    if (!isText(minimum?.garmentId) || !Number.isInteger(minimum?.count) || minimum.count < 0) {
      problems.push('each garment minimum needs a garmentId and a whole count of 0 or more');
    }
  }
  const offcut = input?.rules?.minimumOffcut;
  if (offcut !== undefined && !(isLength(offcut.width) && isLength(offcut.height))) {
    lengthProblem('rules.minimumOffcut width and height');
  }
  if (problems.length > 0) throw new CutPlanInputError(problems);

  // Garments in order of first appearance.
  const garmentIndex = new Map<string, GarmentModel>();
  for (const bin of bins) {
    if (bin.kind !== 'garment') continue;
    const id = bin.garmentId as string;
    if (!garmentIndex.has(id)) garmentIndex.set(id, { id, bins: [], minimum: 0 });
    garmentIndex.get(id)?.bins.push(bin.index);
  }
  const minimumsWithoutPanels: { garmentId: string; count: number }[] = [];
  for (const minimum of minimums) {
    const garment = garmentIndex.get(minimum.garmentId);
    if (garment) garment.minimum = Math.max(garment.minimum, minimum.count);
    else if (minimum.count > 0) {
      const seen = minimumsWithoutPanels.find((m) => m.garmentId === minimum.garmentId);
      if (seen) seen.count = Math.max(seen.count, minimum.count);
      else minimumsWithoutPanels.push({ garmentId: minimum.garmentId, count: minimum.count });
    }
  }

  const types: PieceTypeModel[] = [];
  const typeByKey = new Map<string, PieceTypeModel>();
  const pinned: PinnedPieceModel[] = [];
  for (const [index, piece] of pieces.entries()) {
    const source: PieceSource = piece.source ?? { kind: 'any-garment' };
    const w = stepsUp(piece.width);
    const h = stepsUp(piece.height);
    const rotate = piece.rotate !== false;
    const lengthwise = piece.grain === 'lengthwise';
    if (piece.keptFeature) {
      if (piece.count === 1) {
        const feature = features.get(piece.keptFeature.featureId) as FeatureModel;
        pinned.push({ piece: index, feature, pin: piece.keptFeature, w, h, rotate, lengthwise, source });
      }
      continue;
    }
    if (piece.count === 0) continue;
    const key = `${w}x${h}|${rotate}|${lengthwise}|${sourceKey(source)}`;
    let type = typeByKey.get(key);
    if (!type) {
      type = {
        index: types.length,
        w,
        h,
        rotate,
        lengthwise,
        source,
        restricted: source.kind !== 'any-garment',
        sourceBins: bins.filter((bin) => sourceAllows(source, bin)).map((bin) => bin.index),
        members: [],
        count: 0,
      };
      typeByKey.set(key, type);
      types.push(type);
    }
    type.members.push({ piece: index, count: piece.count });
    type.count += piece.count;
  }

  const binOptions: Orientation[][] = bins.map(() => []);
  for (const type of types) {
    for (const b of type.sourceBins) binOptions[b].push(...orientationsIn(type, bins[b], type.index));
  }

  return {
    unit: isText(input.unit) ? input.unit : 'in',
    input,
    pieces,
    bins,
    types,
    pinned,
    garments: [...garmentIndex.values()],
    minimumsWithoutPanels,
    binOptions,
    minimumOffcut: offcut ? { w: stepsUp(offcut.width), h: stepsUp(offcut.height) } : undefined,
  };
}
