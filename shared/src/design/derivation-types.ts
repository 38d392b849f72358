// What a design's derivation is made of: its pieces, positions, sewing order,
// templates and notes. Types only: deriveDesign (derive-design.ts) makes them,
// and the block kinds and the layout fill them in, so they need not import the
// derivation itself.

import type { RulerStep } from '../rounding';
import type { TemplatePoint } from '../wedge-block';
import type { FabricRef } from './fabric-ref';

export type PieceGroup = 'block' | 'sashing' | 'cornerstones' | 'border' | 'setting';

/** One kind of piece to cut from one fabric, with how many. */
export interface DerivedPiece {
  /** The piece kind, e.g. "block:A:square", "sashing", "border:1". */
  key: string;
  /** Position of this line in the list; also the planner's piece id ("p12"). */
  id: string;
  label: string;
  group: PieceGroup;
  blockId?: string;
  role: string;
  shape: 'square' | 'rectangle' | 'strip' | 'blade pair' | 'circle square';
  /** Cut size as laid on the ruler (rounded up to the ruler step), exact mm. */
  widthMm: string;
  heightMm: string;
  /** 0: used whole; 1: cut once on the diagonal; 2: cut twice (an X). */
  diagonalCuts: 0 | 1 | 2;
  /** Pieces each cut shape gives after its diagonal cuts (a blade pair gives 2 blades). */
  piecesEach: number;
  count: number;
  fabric: FabricRef | null;
  /** Long strips keep the lengthwise grain along their length. */
  lengthwise: boolean;
  note?: string;
}

export interface DerivedPosition {
  index: number;
  blockId: string;
  /** Finished block square in the top's coordinates (mm from the top-left corner), before any turn. */
  x: number;
  y: number;
  side: number;
  /** On point: the block is turned 45 degrees about its centre. */
  onPoint: boolean;
  /** Fabric of each role of the block here (null: the planner chooses from any garment). */
  fabrics: Record<string, FabricRef | null>;
}

export interface SewingStep {
  text: string;
  count?: number;
}

export interface SewingSection {
  title: string;
  steps: SewingStep[];
  pressing: string;
}

export type Template =
  | { id: string; name: string; kind: 'blade'; blockId: string; finished: TemplatePoint[]; cut: TemplatePoint[]; sizeText: SizeNote[] }
  | { id: string; name: string; kind: 'circle' | 'quarter-circle'; blockId: string; cardRadiusMm: number; fabricRadiusMm: number; allowanceMm: number; sizeText: SizeNote[] };

/** A labelled length for printing in either unit system. */
export interface SizeNote {
  label: string;
  mm: string;
}

export interface DesignDerivation {
  ruler: RulerStep;
  allowanceMm: string;
  finished: { widthMm: string; lengthMm: string };
  target: { widthMm: string; lengthMm: string };
  /** Finished minus target (negative: smaller than asked). */
  difference: { widthMm: string; lengthMm: string };
  centre: { widthMm: string; lengthMm: string };
  /** Finished widths across and heights down (borders, sashing, blocks), for drawing. */
  parts: { across: string[]; down: string[] };
  positions: DerivedPosition[];
  pieces: DerivedPiece[];
  sewing: SewingSection[];
  templates: Template[];
  /** Fabric for sashing, cornerstones, each border and the setting triangles, as assigned. */
  layoutFabrics: Record<string, FabricRef | null>;
  totals: { blocks: number; pieces: number };
}
