// A commission's design as the maker sets it: target size, blocks, layout,
// which fabric goes where, and the finishing choices. Stored as JSON (every
// length an exact millimetre decimal string) and derived by derive-design.ts.

import type { BlockSpec } from './kinds';
import type { FabricRef } from './fabric-ref';

export { BLOCK_KINDS, BLOCK_KIND_LABELS, BLOCK_ROLES } from './kinds';
export type { BlockKind, BlockParams, BlockSpec } from './kinds';
export { fabricKey, type FabricRef } from './fabric-ref';

/**
 * A named group of the commission's garments, kept with the design whether or
 * not anything is given to it yet; the planner picks among its garments.
 */
export interface GarmentGroup {
  /** Short id the assignments name it by, e.g. "g1". */
  id: string;
  name: string;
  garmentIds: number[];
}

/**
 * What an assignment covers: a block position (every piece of that block), or
 * a piece kind: `block:<id>:<role>`, `sashing`, `cornerstones`,
 * `border:<n>` (1 = innermost) or `setting-triangles`.
 * A piece-kind assignment wins over a position's.
 */
export type AssignmentTarget = { kind: 'position'; index: number } | { kind: 'piece'; key: string };

export interface Assignment {
  target: AssignmentTarget;
  fabric: FabricRef;
}

export interface DesignBody {
  /** How the maker reads sizes; metric also cuts to the millimetre. */
  units: 'imperial' | 'metric';
  target: {
    /** A mattress preset id (bed-sizes.ts) or null for a custom size. */
    preset: string | null;
    dropMm: string | null;
    widthMm: string;
    lengthMm: string;
  };
  layout: {
    setting: 'straight' | 'on-point';
    /** Straight: rows and columns of blocks. On point: whole blocks down and across. */
    rows: number;
    columns: number;
    /** Finished block side. */
    blockMm: string;
    sashing: { widthMm: string; cornerstones: boolean } | null;
    /** Border widths, innermost first. */
    borders: string[];
  };
  blocks: BlockSpec[];
  /** Block id at each position, row by row; a shorter list repeats. */
  pattern: string[];
  /**
   * The owner's groups of garments. Designs saved before groups were listed
   * have none stored: garment-groups.ts reads them from their assignments.
   */
  groups?: GarmentGroup[];
  assignments: Assignment[];
  finishing: {
    bindingStockId: number | null;
    bindingStripMm: string;
    backingStockId: number | null;
    waddingStockId: number | null;
    /** Studio fabric bought for this piece will be pre-washed. */
    prewash: boolean;
    /** Shrinkage allowed for when pre-washing, in percent (common practice 2 to 5 for cotton). */
    shrinkPercent: string;
  };
  rules: {
    /**
     * Pieces each garment must give at least. Every garment with panels gives
     * at least one (a memory piece holds something of each garment) unless the
     * maker marks it not used, so 0 and 1 plan alike.
     */
    minimumPerGarment: number;
    /** Garments the maker marks not used: nothing is asked of them, and their giving no piece is no warning. Absent: none. */
    unusedGarmentIds?: number[];
  };
}
