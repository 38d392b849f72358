// A template's outlines for drawing at 1:1, the same for the print page (an
// SVG in millimetres) and the PDF (scaled to points).

import type { Template } from '../design/derive-design';

export type OutlinePoint = readonly [number, number];

/** A template's outlines in millimetres, y down, its cut outline's top-left at (0, 0). */
export interface TemplateOutline {
  /** Size of the cut outline, mm. */
  widthMm: number;
  heightMm: number;
  /** The cut line (seam or turn allowance included) and the inner line: a blade's sewing line, a circle's card. */
  cut: OutlinePoint[];
  inner: OutlinePoint[];
  /** Grain line, running along the blade (or top to bottom of a circle): from 80% of the height to 20%, measured from the bottom. */
  grain: { x1: number; y1: number; x2: number; y2: number };
}

/** The printable width and height one sheet leaves for a template under 12 mm margins, on A4 and on US Letter alike. */
export const SHEET_AREA_MM = { width: 186, height: 235 } as const;

const ring = (r: number, steps: number, sweep: number): OutlinePoint[] =>
  Array.from({ length: steps + 1 }, (_, i) => [r * Math.cos((i * sweep) / steps), r * Math.sin((i * sweep) / steps)] as const);

const round = (n: number) => Math.round(n * 1e4) / 1e4;

/**
 * The outlines of a template in millimetres. Template points come with y up and
 * the plate centre at the origin; a drawing wants y down from the top-left corner.
 */
export function templateOutline(t: Template): TemplateOutline {
  let cut: OutlinePoint[];
  let inner: OutlinePoint[];
  if (t.kind === 'blade') {
    cut = t.cut.map((p) => [p.x, p.y] as const);
    inner = t.finished.map((p) => [p.x, p.y] as const);
  } else if (t.kind === 'circle') {
    cut = ring(t.fabricRadiusMm, 360, 2 * Math.PI).slice(0, -1);
    inner = ring(t.cardRadiusMm, 360, 2 * Math.PI).slice(0, -1);
  } else {
    const s = t.allowanceMm;
    cut = [[-s, -s], [t.fabricRadiusMm, -s], ...ring(t.fabricRadiusMm, 90, Math.PI / 2), [-s, t.fabricRadiusMm]];
    inner = [[0, 0], ...ring(t.cardRadiusMm, 90, Math.PI / 2)];
  }
  const xs = cut.map((p) => p[0]);
  const ys = cut.map((p) => p[1]);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  const at = ([x, y]: OutlinePoint): OutlinePoint => [round(x - minX), round(maxY - y)];
  const height = maxY - minY;
  const gx = t.kind === 'quarter-circle' ? t.cardRadiusMm / 2 : (minX + maxX) / 2;
  const [x1, y1] = at([gx, minY + height * 0.8]);
  const [x2, y2] = at([gx, minY + height * 0.2]);
  return { widthMm: round(maxX - minX), heightMm: round(height), cut: cut.map(at), inner: inner.map(at), grain: { x1, y1, x2, y2 } };
}
