// What planning a design against the commission's garments and the studio
// stock takes and gives: the sources, each garment's use, what is short, what
// to buy, the plan summary and the kept-feature pieces. Types only.

import type { CutPlan } from '../cut-plan/cut-plan';

/**
 * A kept feature measured on a panel (a pocket, a label, embroidery): its top-left
 * corner from the panel's top-left corner and its size, exact millimetres.
 */
export interface PanelFeature {
  name: string;
  xMm: string;
  yMm: string;
  widthMm: string;
  heightMm: string;
}

export interface SourceGarment {
  id: number;
  description: string;
  colour: string | null;
  fibre: string;
  construction: string;
  print: string;
  panels: { id: number; name: string; widthMm: string; heightMm: string; grain: 'vertical' | 'horizontal'; features?: PanelFeature[] }[];
}

export interface SourceStock {
  id: number;
  name: string;
  colour: string | null;
  fibre: string;
  widthMm: string;
  lengthMm: string;
  costUnit?: 'metre' | 'yard';
}

export interface DesignSources {
  garments: SourceGarment[];
  stock: SourceStock[];
}

export interface GarmentUse {
  garmentId: number;
  description: string;
  piecesCut: number;
  areaMm2: number;
  areaUsedMm2: number;
  yield: number;
  uses: { pieceId: string; label: string; count: number }[];
}

export interface ShortLine {
  /**
   * The derived piece's id; for the block piece kept around a feature, that id,
   * "@" and the feature's id; for a feature no block piece can hold, "@" and its id.
   */
  pieceId: string;
  label: string;
  count: number;
  reason: string;
  detail: string;
  /** What the maker can do about it, most direct first. */
  remedies: string[];
}

export interface ShoppingLine {
  stockId: number;
  name: string;
  widthMm: string;
  /** What the pieces, binding and backing need of this fabric. */
  needMm: string;
  onHandMm: string;
  /** Need beyond what is on hand, before shrinkage and rounding. */
  shortMm: string;
  /** Short length grown for shrinkage in the pre-wash (equals shortMm without it). */
  grossMm: string;
  /** Rounded up to the shop increment; "0" when nothing is to buy. */
  buyMm: string;
  increment: string;
  uses: string[];
}

export interface DesignPlanSummary {
  plan: CutPlan;
  garments: GarmentUse[];
  shortfall: ShortLine[];
  minimumsShort: { garmentId: number; description: string; required: number; achieved: number; detail: string }[];
  /**
   * Garments used in the piece (with panels, not marked not used) that give no
   * piece at all: the loud warning of a memory piece missing a garment. Absent
   * on plans stored before this was listed.
   */
  garmentsGivingNone?: { garmentId: number; description: string; message: string }[];
  shopping: ShoppingLine[];
  /** Each kept feature the plan holds whole, and the copy of the block piece cut around it. Absent on plans stored before this was listed. */
  keptFeatures?: KeptFeaturePiece[];
  binding: { stockId: number | null; strips: number; stripWidthMm: string; lengthMm: string; fabricLengthMm: string };
  backing: { stockId: number | null; widthMm: string; lengthMm: string; panels: number; fabricLengthMm: string; method: string };
  wadding: { stockId: number | null; widthMm: string; lengthMm: string; fromRollMm: string | null; pieces: number | null };
  totals: { piecesRequested: number; piecesPlaced: number; piecesShort: number; garmentYield: number };
}

/** A kept feature the plan holds whole, and the copy of the block piece cut centred on it. */
export interface KeptFeaturePiece {
  /** The planner's id of the feature (keptFeatureId). */
  featureId: string;
  /** The feature's name as measured, e.g. "breast pocket". */
  feature: string;
  garmentId: number;
  /** The garment's description. */
  garment: string;
  /** The panel's name. */
  panel: string;
  /** The derived piece, and which copy of it (from 1). */
  pieceId: string;
  copy: number;
}
