// The quilt top as shapes at scale (millimetres from the top-left corner),
// each filled by the fabric assigned to it. The app draws these as SVG; the
// printouts draw the same shapes.

import type { BlockSpec, DesignBody, FabricRef } from './design-body';
import { fabricKey } from './design-body';
import type { DerivedPosition, DesignDerivation } from './derive-design';
import type { KeptFeaturePlace } from './kept-feature-places';
import { blockKind } from './kinds';
import { rect } from './kinds/block-kind';

export interface DrawingShape {
  /** Polygon corners in mm. */
  points: [number, number][];
  /** fabricKey() of the fabric, or "any" for the planner's choice. */
  fill: string;
  /** What the shape is, for titles and tests ("block 3", "sashing", "border 1"). */
  part: string;
  /** Block position index, for block shapes. */
  position?: number;
}

export interface QuiltDrawing {
  width: number;
  height: number;
  shapes: DrawingShape[];
}


/** Quilt top drawing: borders, sashing and cornerstones, then each block's own shapes. */
export function designDrawing(body: DesignBody, d: DesignDerivation): QuiltDrawing {
  const width = Number(d.finished.widthMm);
  const height = Number(d.finished.lengthMm);
  const shapes: DrawingShape[] = [];
  const fill = (f: FabricRef | null | undefined) => fabricKey(f ?? null);

  // Borders, outermost first so inner ones paint over.
  const borders = body.layout.borders.map(Number);
  let inset = borders.reduce((a, b) => a + b, 0);
  for (let i = borders.length - 1; i >= 0; i--) {
    inset -= borders[i]!;
    shapes.push({ points: rect(inset, inset, width - 2 * inset, height - 2 * inset), fill: fill(d.layoutFabrics[`border:${i + 1}`]), part: `border ${i + 1}` });
  }
  const b = borders.reduce((a, c) => a + c, 0);
  const cw = Number(d.centre.widthMm);
  const ch = Number(d.centre.lengthMm);
  if (body.layout.setting === 'straight') {
    if (body.layout.sashing) {
      shapes.push({ points: rect(b, b, cw, ch), fill: fill(d.layoutFabrics['sashing']), part: 'sashing' });
      if (body.layout.sashing.cornerstones) {
        const s = Number(body.layout.sashing.widthMm);
        const side = Number(body.layout.blockMm);
        for (let r = 1; r < body.layout.rows; r++) {
          for (let c = 1; c < body.layout.columns; c++) {
            shapes.push({ points: rect(b + c * (side + s) - s, b + r * (side + s) - s, s, s), fill: fill(d.layoutFabrics['cornerstones']), part: 'cornerstone' });
          }
        }
      }
    }
  } else {
    shapes.push({ points: rect(b, b, cw, ch), fill: fill(d.layoutFabrics['setting-triangles']), part: 'setting triangles' });
  }
  const specs = new Map(body.blocks.map((s) => [s.id, s]));
  for (const p of d.positions) shapes.push(...blockShapes(specs.get(p.blockId)!, p));
  return { width, height, shapes };
}

/** The outline of the block piece holding a kept feature: the whole block, or its rail; null when the top has no such place. */
export function keptFeatureOutline(body: DesignBody, d: DesignDerivation, place: Pick<KeptFeaturePlace, 'position' | 'rail'>): [number, number][] | null {
  const p = d.positions.find((x) => x.index === place.position);
  if (!p) return null;
  const spec = body.blocks.find((b) => b.id === p.blockId);
  const rails = spec && blockKind(spec.kind).wholePiece?.rails?.(spec);
  if (place.rail !== null && rails) return turn(p, rect(p.x, p.y + (place.rail * p.side) / rails, p.side, p.side / rails));
  return turn(p, rect(p.x, p.y, p.side, p.side));
}

function turn(p: DerivedPosition, pts: [number, number][]): [number, number][] {
  if (!p.onPoint) return pts;
  const cx = p.x + p.side / 2;
  const cy = p.y + p.side / 2;
  const c = Math.SQRT1_2;
  return pts.map(([x, y]) => [cx + (x - cx) * c - (y - cy) * c, cy + (x - cx) * c + (y - cy) * c]);
}

/** The block's own shapes at a position, as its kind draws them, turned with the position. */
function blockShapes(spec: BlockSpec, p: DerivedPosition): DrawingShape[] {
  const out: DrawingShape[] = [];
  const part = `block ${p.index + 1}`;
  blockKind(spec.kind).shapes(spec, p, (pts, role) => out.push({ points: turn(p, pts), fill: fabricKey(p.fabrics[role] ?? null), part, position: p.index }));
  return out;
}
