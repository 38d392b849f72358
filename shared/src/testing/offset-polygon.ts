// Independent check of cut shapes for the specs: offsets a finished polygon
// outward with clipper-lib (integer maths, scaled by 1e6, mitred corners with
// a miter limit of 3 so sharp tips are not flattened).

import * as ClipperLib from 'clipper-lib';

export interface XY {
  x: number;
  y: number;
}

const SCALE = 1e6;

function toPath(points: readonly XY[]): ClipperLib.Path {
  return points.map((p) => ({ X: Math.round(p.x * SCALE), Y: Math.round(p.y * SCALE) }));
}

function fromPath(path: ClipperLib.Path): XY[] {
  return path.map((p) => ({ x: p.X / SCALE, y: p.Y / SCALE }));
}

/** The polygon grown outward by `delta` on every edge (same unit as the points). */
export function offsetPolygon(points: readonly XY[], delta: number): XY[] {
  const offset = new ClipperLib.ClipperOffset(3, 0.25);
  offset.AddPath(toPath(points), ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
  const solution: ClipperLib.Paths = [];
  offset.Execute(solution, delta * SCALE);
  if (solution.length !== 1) throw new Error(`expected one offset polygon, got ${solution.length}`);
  return fromPath(solution[0]);
}

/** Area of the overlap of two polygons (0 when they only touch). */
export function overlapArea(a: readonly XY[], b: readonly XY[]): number {
  const clipper = new ClipperLib.Clipper();
  clipper.AddPath(toPath(a), ClipperLib.PolyType.ptSubject, true);
  clipper.AddPath(toPath(b), ClipperLib.PolyType.ptClip, true);
  const solution: ClipperLib.Paths = [];
  clipper.Execute(ClipperLib.ClipType.ctIntersection, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  return solution.reduce((sum, path) => sum + Math.abs(ClipperLib.Clipper.Area(path)), 0) / (SCALE * SCALE);
}

export function boundingBox(points: readonly XY[]): { minX: number; maxX: number; minY: number; maxY: number; width: number; height: number } {
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  return { minX, maxX, minY, maxY, width: maxX - minX, height: maxY - minY };
}

export function edgeLengths(points: readonly XY[]): number[] {
  return points.map((p, i) => {
    const q = points[(i + 1) % points.length];
    return Math.hypot(q.x - p.x, q.y - p.y);
  });
}
