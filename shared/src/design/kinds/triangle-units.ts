// What the half- and quarter-square triangle kinds share: a block of n x n unit squares.

import type { DerivedPosition, SewingStep } from '../derivation-types';

/** Calls `draw` with the top-left corner and side of each unit square of the block, row by row. */
export function eachUnit(n: number, p: DerivedPosition, draw: (ux: number, uy: number, u: number) => void): void {
  const u = p.side / n;
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) draw(p.x + c * u, p.y + r * u, u);
}

/** Sewing more than one unit each way into blocks. */
export function unitRows(units: number, blocks: number): SewingStep[] {
  return units > 1 ? [{ text: `Sew the units into rows of ${units}, then the rows into blocks`, count: blocks * units }] : [];
}
