// Types of the cut planner's input and result (see cut-plan.ts for units and coordinates).

/** Which way the lengthwise grain (parallel to the selvedge) runs in a panel. */
export type GrainDirection = 'along-height' | 'along-width' | 'unknown';

/** A rectangle in a panel's coordinates. */
export interface PlanRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Something in a panel to keep whole inside one piece: a pocket, a label, embroidery. */
export interface KeptFeatureInput extends PlanRect {
  /** Unique across the whole input. */
  id: string;
  label?: string;
}

/** One usable flat rectangle of a client's garment, as the maker measured it. */
export interface GarmentPanelInput {
  garmentId: string;
  /** Unique across all panels and studio fabrics. */
  panelId: string;
  width: number;
  height: number;
  /** Default 'along-height': the panel was measured with the grain running top to bottom. */
  grain?: GrainDirection;
  /** A print with an up and a down: pieces are never turned on it. Default false. */
  directional?: boolean;
  features?: KeptFeatureInput[];
  label?: string;
}

/** Fabric from the studio's stock or to be bought. Its lengthwise grain runs along its length. */
export interface StudioFabricInput {
  /** Unique across all panels and studio fabrics. */
  fabricId: string;
  /** Usable width across the fabric (selvedges removed). */
  width: number;
  /** Length available, or 'unlimited' to plan what must be bought at this width. */
  length: number | 'unlimited';
  directional?: boolean;
  label?: string;
}

/** Where a piece may be cut from. */
export type PieceSource =
  | { kind: 'any-garment' }
  | { kind: 'garment'; garmentId: string }
  | { kind: 'garment-group'; name: string; garmentIds: string[] }
  | { kind: 'studio-fabric'; fabricId: string };

/** Pins a piece to a kept feature: the feature must lie whole inside the piece. */
export interface KeptFeaturePin {
  featureId: string;
  /**
   * 'centred', or the position of the feature's top-left corner inside the
   * piece (distance from the piece's left and top edges). A piece placed at
   * an offset is never turned; a centred piece may be where rules allow.
   */
  placement: 'centred' | { x: number; y: number };
}

/** A piece to cut, at its cut size (seam allowance included). */
export interface PieceInput {
  /** Unique across pieces. */
  id: string;
  width: number;
  height: number;
  /** Whole number of copies, 0 or more. A pinned piece must have count 1. */
  count: number;
  /** Default { kind: 'any-garment' }. */
  source?: PieceSource;
  /** 'lengthwise': the piece's height must run along the panel's lengthwise grain. Default 'any'. */
  grain?: 'lengthwise' | 'any';
  /** May be turned by 90 degrees where the panel allows. Default true. */
  rotate?: boolean;
  keptFeature?: KeptFeaturePin;
  label?: string;
}

export interface GarmentMinimum {
  garmentId: string;
  /** Pieces the garment must give at least ("every shirt in it"). */
  count: number;
}

export interface CutPlanRules {
  /** Offcuts at least this size (either way round) are listed to keep. Default: none listed. */
  minimumOffcut?: { width: number; height: number };
  garmentMinimums?: GarmentMinimum[];
}

export interface CutPlanInput {
  /** A label for the unit of every length, echoed in the result (e.g. 'in'). Default 'in'. */
  unit?: string;
  panels: GarmentPanelInput[];
  studioFabrics?: StudioFabricInput[];
  pieces: PieceInput[];
  rules?: CutPlanRules;
}

/** One copy of a piece placed in a panel. */
export interface Placement {
  pieceId: string;
  /** 1-based number of this copy of the piece. */
  copy: number;
  /** The garment panel's panelId or the studio fabric's fabricId. */
  panelId: string;
  garmentId?: string;
  fabricId?: string;
  /** Position and size as laid in the panel (after any turn), each at most 0.001 larger than asked. */
  x: number;
  y: number;
  width: number;
  height: number;
  /** Turned by 90 degrees: the piece's width runs along the panel's height. */
  rotated: boolean;
  featureId?: string;
}

/** What a region of a panel becomes. */
export type RegionContent = 'piece' | 'strip' | 'offcut' | 'waste';

export interface CutRegion extends PlanRect {
  /** Path label: '1' is the first part cut from the panel, '1.2' the second part cut from that. */
  label: string;
  content: RegionContent;
  pieceId?: string;
  copy?: number;
}

/**
 * One pass of the rotary cutter, straight and from edge to edge of the region
 * being cut. `at` is measured from the region's top edge (a horizontal cut)
 * or its left edge (a vertical cut): the part cut off lies on that side.
 */
export interface CutStep {
  step: number;
  /** 1: cuts in the whole panel (the strips); 2: sub-cuts of those; 3 and on: further trims. */
  stage: number;
  /** Label of the region being cut ('panel' for the whole panel). */
  region: string;
  /** The region as it lies when this cut is made. */
  regionRect: PlanRect;
  direction: 'horizontal' | 'vertical';
  at: number;
  /** Length of the cut: the region's width (horizontal) or height (vertical). */
  length: number;
  cutsOff: CutRegion;
  /** What is left of the region; its label is the region's own until the last cut. */
  remaining: CutRegion;
}

export interface PanelPlan {
  panelId: string;
  kind: 'garment' | 'studio';
  garmentId?: string;
  fabricId?: string;
  /** Size as given; for unlimited studio fabric the height is the length used. */
  width: number;
  height: number;
  /** The size the cuts work in: the given size rounded down to 0.001. */
  usableWidth: number;
  usableHeight: number;
  piecesCut: number;
  area: number;
  /** Area of the pieces at the sizes asked. */
  areaUsed: number;
  /** areaUsed / area, a fraction from 0 to 1 (0 for an empty panel of no area). */
  yield: number;
  offcuts: PlanRect[];
  cuts: CutStep[];
}

export interface GarmentSummary {
  garmentId: string;
  panels: number;
  piecesCut: number;
  area: number;
  areaUsed: number;
  yield: number;
  minimum?: number;
}

export interface StudioFabricSummary {
  fabricId: string;
  width: number;
  lengthAvailable: number | 'unlimited';
  /** Length down to the lowest cut (for unlimited fabric: what to buy before rounding to the shop's step). */
  lengthUsed: number;
  piecesCut: number;
  areaUsed: number;
  /** Extra length at this width that would hold the pieces short on this fabric, when any are. */
  extraLengthNeeded?: number;
}

export type ShortfallReason = 'no-panel-large-enough' | 'rule-not-met' | 'not-enough-area';

export interface PieceShortfall {
  pieceId: string;
  /** Copies that could not be placed. */
  count: number;
  reason: ShortfallReason;
  detail: string;
  /**
   * The smallest extra fabric that would hold the short copies, where it can
   * be computed: for garments, a rectangle of exactly their area (so no
   * smaller one exists); for a studio fabric, the length at its width found by
   * packing them (an upper bound on the least).
   */
  extraFabric?: { width: number; height: number };
}

export interface GarmentMinimumShortfall {
  garmentId: string;
  required: number;
  achieved: number;
  reason: ShortfallReason | 'not-enough-pieces';
  detail: string;
}

export interface CutPlanTotals {
  piecesRequested: number;
  piecesPlaced: number;
  piecesShort: number;
  areaRequested: number;
  areaPlaced: number;
  garmentArea: number;
  garmentAreaUsed: number;
  /** garmentAreaUsed / garmentArea. */
  garmentYield: number;
  /** Garment panels, finite studio fabrics and the used length of unlimited ones. */
  fabricArea: number;
  /** areaPlaced / fabricArea. */
  yield: number;
}

export interface CutPlan {
  unit: string;
  /** The planner's resolution in the unit: 0.001. */
  resolution: number;
  placements: Placement[];
  panels: PanelPlan[];
  garments: GarmentSummary[];
  studioFabrics: StudioFabricSummary[];
  shortfall: { pieces: PieceShortfall[]; garmentMinimums: GarmentMinimumShortfall[] };
  totals: CutPlanTotals;
  /** Name of the packing order that gave this plan (the planner tries a few and keeps the best). */
  strategy: string;
}
