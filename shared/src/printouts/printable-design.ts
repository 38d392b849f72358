// What the design printouts are drawn from, the same on the server (read from
// the database) and in the app (the design screen): the commission, its
// latest saved version, its garments and studio fabrics, and the fabric legend.

import type { DesignBody } from '../design/design-body';
import type { DesignDerivation } from '../design/derive-design';
import type { DesignPlanSummary, PanelFeature } from '../design/plan-design';
import { Length } from '../measure';
import { formatCutSize, formatFinishedSize } from '../format-length';
import { showDate } from '../calendar-date';
import type { UnitSystem } from '../format-length';
import type { KeyFabric } from './printout-content';

export interface PrintableGarment {
  id: number;
  description: string;
  colour: string | null;
  construction: string;
  print: string;
  panels: readonly { id: number; name: string; features?: readonly PanelFeature[] }[];
}

export interface PrintableDesign {
  commission: { id: number; title: string };
  /** The latest saved version; none when the design was never saved. */
  version: { version: number; body: DesignBody; derived: DesignDerivation; plan: DesignPlanSummary } | null;
  garments: readonly PrintableGarment[];
  stock: readonly { id: number; name: string }[];
  /** The fabric legend: every fabric the design may name, a group with the stripes it is drawn in. */
  fabrics: readonly KeyFabric[];
}

/** What every printout is built with besides its data. */
export interface PrintOptions {
  /** The day it is printed, YYYY-MM-DD. */
  printedOn: string;
  /** The sheet a PDF is laid out for, when the printout offers a choice. */
  paper?: Paper;
}

export const PAPERS = { a4: 'A4', letter: 'US Letter' } as const;
export type Paper = keyof typeof PAPERS;

/** "Work-shirt memory quilt, design version 3, printed 4 Dec 2026": the first line of a design printout, its date in the screens' long form. */
export function versionLine(d: PrintableDesign, options: PrintOptions, extra = ''): string {
  return `${d.commission.title}, design version ${d.version?.version ?? 0}${extra}, printed ${showDate(options.printedOn)}`;
}

/** Lengths in a design's units: cut sizes rounded up, positions and finished sizes to the nearest mark. */
export function measuresIn(system: UnitSystem) {
  return {
    cut: (mm: string | number) => formatCutSize(Length.millimetres(String(mm)), system),
    at: (mm: string | number) => formatFinishedSize(Length.millimetres(String(mm)), system),
  };
}

/** The words of a design printout for a commission with no saved design. */
export const NO_DESIGN_YET = 'This commission has no saved design yet.';
