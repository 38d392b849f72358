// The quilt top as shapes at scale (millimetres from the top-left corner),
// each filled by the fabric assigned to it. The app draws these as SVG; the
// printouts draw the same shapes.

import type { BlockSpec, DesignBody, FabricRef } from './design-body';
import { fabricKey } from './design-body';
import type { DerivedPosition, DesignDerivation } from './derive-design';
import type { KeptFeaturePlace } from './kept-feature-places';

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

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

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
  if (place.rail !== null && spec?.kind === 'rectangles') {
    const n = spec.units ?? 1;
    return turn(p, rect(p.x, p.y + (place.rail * p.side) / n, p.side, p.side / n));
  }
  return turn(p, rect(p.x, p.y, p.side, p.side));
}

function turn(p: DerivedPosition, pts: [number, number][]): [number, number][] {
  if (!p.onPoint) return pts;
  const cx = p.x + p.side / 2;
  const cy = p.y + p.side / 2;
  const c = Math.SQRT1_2;
  return pts.map(([x, y]) => [cx + (x - cx) * c - (y - cy) * c, cy + (x - cx) * c + (y - cy) * c]);
}

function blockShapes(spec: BlockSpec, p: DerivedPosition): DrawingShape[] {
  const out: DrawingShape[] = [];
  const part = `block ${p.index + 1}`;
  const add = (pts: [number, number][], role: string) => out.push({ points: turn(p, pts), fill: fabricKey(p.fabrics[role] ?? null), part, position: p.index });
  const { x, y, side: s } = p;
  const n = spec.units ?? 1;
  switch (spec.kind) {
    case 'square':
      add(rect(x, y, s, s), 'square');
      break;
    case 'rectangles':
      for (let i = 0; i < n; i++) add(rect(x, y + (i * s) / n, s, s / n), 'rail');
      break;
    case 'hst':
    case 'qst': {
      const u = s / n;
      for (let r = 0; r < n; r++) {
        for (let c = 0; c < n; c++) {
          const ux = x + c * u;
          const uy = y + r * u;
          if (spec.kind === 'hst') {
            add([[ux, uy], [ux + u, uy], [ux, uy + u]], 'light');
            add([[ux + u, uy], [ux + u, uy + u], [ux, uy + u]], 'dark');
          } else {
            const m: [number, number] = [ux + u / 2, uy + u / 2];
            add([[ux, uy], [ux + u, uy], m], 'dark');
            add([[ux + u, uy], [ux + u, uy + u], m], 'light');
            add([[ux + u, uy + u], [ux, uy + u], m], 'dark');
            add([[ux, uy + u], [ux, uy], m], 'light');
          }
        }
      }
      break;
    }
    case 'flying-geese': {
      const gh = s / n;
      const gw = gh * 2;
      for (let c = 0; c < n / 2; c++) {
        for (let r = 0; r < n; r++) {
          const gx = x + c * gw;
          const gy = y + r * gh;
          add(rect(gx, gy, gw, gh), 'sky');
          add([[gx, gy + gh], [gx + gw / 2, gy], [gx + gw, gy + gh]], 'goose');
        }
      }
      break;
    }
    case 'foundation': {
      add(rect(x, y, s, s), 'foundation');
      const strips = 5;
      for (let i = 0; i < strips; i += 2) {
        const a = (i / strips) * 2 * s;
        const b2 = ((i + 1) / strips) * 2 * s;
        const clip = (t: number): [number, number][] => (t <= s ? [[x + t, y], [x, y + t]] : [[x + s, y + t - s], [x + t - s, y + s]]);
        const [p1, p2] = clip(a);
        const [p3, p4] = clip(b2);
        const pts: [number, number][] = [p1!, p3!];
        if (a < s && b2 > s) pts.splice(1, 0, [x + s, y]);
        pts.push(p4!);
        if (a < s && b2 > s) pts.push([x, y + s]);
        pts.push(p2!);
        add(pts, 'strip');
      }
      break;
    }
    case 'plate':
    case 'fan': {
      add(rect(x, y, s, s), 'background');
      const blades = spec.blades ?? (spec.kind === 'plate' ? 20 : 5);
      const R = Number(spec.outerRadiusMm ?? s / 2 - 25.4);
      const r0 = Number(spec.innerRadiusMm ?? 50.8);
      const plate = spec.kind === 'plate';
      const cx = plate ? x + s / 2 : x;
      const cy = plate ? y + s / 2 : y + s;
      const sweep = plate ? 2 * Math.PI : Math.PI / 2;
      const start = plate ? 0 : -Math.PI / 2;
      const at = (rad: number, a: number): [number, number] => [cx + rad * Math.cos(a), cy + rad * Math.sin(a)];
      for (let i = 0; i < blades; i++) {
        const a0 = start + (i * sweep) / blades;
        const a1 = start + ((i + 1) * sweep) / blades;
        add([at(r0, a0), at(R, a0), at(R, a1), at(r0, a1)], 'blades');
      }
      const circle: [number, number][] = [];
      const steps = plate ? 36 : 10;
      for (let i = 0; i <= steps; i++) circle.push(at(r0 + 6.35, start + (i * sweep) / steps));
      if (!plate) circle.push([cx, cy]);
      add(circle, plate ? 'centre' : 'corner');
      break;
    }
  }
  return out;
}
