// The instances bench:cut-plan runs: a fixed, seeded set of memory quilts (10
// to 60 garments with 2 to 5 panels each, 50 to 1,000 pieces of the sizes such
// quilts use) and perfect-packing sheets cut by random guillotine cuts.

import type { CutPlanInput, GarmentPanelInput, PieceInput } from '../shared/src/cut-plan/index';
import { perfectInstance, seededRandom } from '../shared/src/cut-plan/perfect-instance';

export interface Instance {
  name: string;
  realistic: boolean;
  input: CutPlanInput;
}

/** Garment kinds: panel name, width range, height range (inches, as measured flat). */
const GARMENT_KINDS: { kind: string; panels: [string, number, number, number, number][] }[] = [
  {
    kind: 'shirt',
    panels: [
      ['back', 21, 25, 26, 30],
      ['left front', 10, 12.5, 24, 28],
      ['right front', 10, 12.5, 24, 28],
      ['left sleeve', 8, 10.5, 18, 23],
      ['right sleeve', 8, 10.5, 18, 23],
    ],
  },
  {
    kind: 't-shirt',
    panels: [
      ['front', 17, 21, 20, 25],
      ['back', 17, 21, 21, 26],
      ['left sleeve', 7, 9, 5, 7.5],
      ['right sleeve', 7, 9, 5, 7.5],
    ],
  },
  {
    kind: 'jeans',
    panels: [
      ['left front leg', 9, 12, 30, 36],
      ['right front leg', 9, 12, 30, 36],
      ['left back leg', 10, 13, 30, 36],
      ['right back leg', 10, 13, 30, 36],
      ['seat', 14, 17, 8, 11],
    ],
  },
  {
    kind: 'dress',
    panels: [
      ['skirt front', 22, 30, 20, 28],
      ['skirt back', 22, 30, 20, 28],
      ['bodice front', 12, 16, 10, 14],
      ['bodice back', 12, 16, 10, 14],
    ],
  },
  {
    kind: 'pyjama top',
    panels: [
      ['back', 19, 23, 24, 27],
      ['front', 9, 11.5, 22, 26],
      ['sleeve', 8, 10, 17, 21],
    ],
  },
  {
    kind: 'baby grow',
    panels: [
      ['front', 9, 12, 14, 18],
      ['back', 9, 12, 14, 18],
    ],
  },
  {
    kind: 'wool jumper',
    panels: [
      ['front', 18, 22, 22, 26],
      ['back', 18, 22, 22, 26],
      ['left sleeve', 7, 9, 18, 22],
      ['right sleeve', 7, 9, 18, 22],
    ],
  },
];

/** Cut sizes memory quilts use (seam allowance included): squares, rectangles, strips. */
const PIECE_SIZES: { w: number; h: number; strip?: boolean; weight: number }[] = [
  { w: 2.5, h: 2.5, weight: 3 },
  { w: 3.5, h: 3.5, weight: 3 },
  { w: 4.5, h: 4.5, weight: 4 },
  { w: 5, h: 5, weight: 3 },
  { w: 5.5, h: 5.5, weight: 2 },
  { w: 6.5, h: 6.5, weight: 5 },
  { w: 8.5, h: 8.5, weight: 3 },
  { w: 9.5, h: 9.5, weight: 2 },
  { w: 10.5, h: 10.5, weight: 2 },
  { w: 12.5, h: 12.5, weight: 2 },
  { w: 2.5, h: 4.5, weight: 3 },
  { w: 3.5, h: 6.5, weight: 3 },
  { w: 4.5, h: 8.5, weight: 2 },
  { w: 2.5, h: 6.5, weight: 2 },
  { w: 6.5, h: 12.5, weight: 2 },
  { w: 3.5, h: 9.5, weight: 1 },
  { w: 4.5, h: 6.5, weight: 2 },
  { w: 1.5, h: 12.5, strip: true, weight: 2 },
  { w: 2.5, h: 12.5, strip: true, weight: 2 },
  { w: 2.5, h: 20.5, strip: true, weight: 1 },
  { w: 2, h: 24.5, strip: true, weight: 1 },
];

const quarter = (v: number) => Math.round(v * 4) / 4;

function realisticInstance(name: string, seed: number, garments: number, pieces: number, demand: number): Instance {
  const random = seededRandom(seed);
  const between = (lo: number, hi: number) => lo + random() * (hi - lo);
  const pickWeighted = <T extends { weight: number }>(list: T[]): T => {
    const total = list.reduce((s, x) => s + x.weight, 0);
    let r = random() * total;
    for (const x of list) if ((r -= x.weight) < 0) return x;
    return list[list.length - 1];
  };

  // The quilt: a handful of piece sizes with counts summing to `pieces`.
  const typeCount = Math.min(PIECE_SIZES.length, 3 + Math.floor(random() * 3) + Math.floor(pieces / 200));
  const sizes: typeof PIECE_SIZES = [];
  while (sizes.length < typeCount) {
    const size = pickWeighted(PIECE_SIZES);
    if (!sizes.includes(size)) sizes.push(size);
  }
  const weights = sizes.map(() => 0.3 + random());
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const counts = weights.map((w) => Math.max(1, Math.floor((w / weightSum) * pieces)));
  for (let i = 0; counts.reduce((a, b) => a + b, 0) < pieces; i = (i + 1) % counts.length) counts[i]++;
  const demandArea = sizes.reduce((s, size, i) => s + size.w * size.h * counts[i], 0);

  // The garments, then scaled so the fabric offered is demandArea / demand.
  const raw: { garmentId: string; kind: string; directional: boolean; panels: [string, number, number][] }[] = [];
  for (let g = 0; g < garments; g++) {
    const kind = GARMENT_KINDS[Math.floor(random() * GARMENT_KINDS.length)];
    const keep = Math.max(2, Math.min(kind.panels.length, 2 + Math.floor(random() * 4)));
    const chosen = [...kind.panels].sort(() => random() - 0.5).slice(0, keep);
    raw.push({
      garmentId: `${kind.kind.replace(/ /g, '-')}-${g + 1}`,
      kind: kind.kind,
      directional: random() < 0.15,
      panels: chosen.map(([panel, w0, w1, h0, h1]) => [panel, between(w0, w1), between(h0, h1)]),
    });
  }
  const supply = raw.reduce((s, g) => s + g.panels.reduce((t, [, w, h]) => t + w * h, 0), 0);
  const scale = Math.min(1.35, Math.max(0.75, Math.sqrt(demandArea / demand / supply)));
  const panels: GarmentPanelInput[] = raw.flatMap((g) =>
    g.panels.map(([panel, w, h], i) => ({
      garmentId: g.garmentId,
      panelId: `${g.garmentId}/${i + 1}-${panel.replace(/ /g, '-')}`,
      width: quarter(w * scale),
      height: quarter(h * scale),
      grain: random() < 0.1 ? ('along-width' as const) : ('along-height' as const),
      directional: g.directional,
    })),
  );

  const list: PieceInput[] = sizes.map((size, i) => {
    const piece: PieceInput = { id: `${size.w}x${size.h}`, width: size.w, height: size.h, count: counts[i] };
    if (size.strip && random() < 0.5) piece.grain = 'lengthwise';
    return piece;
  });
  // A few pieces the client asked for from particular garments.
  const named = Math.max(1, Math.floor(garments / 8));
  for (let k = 0; k < named; k++) {
    const g = raw[Math.floor(random() * raw.length)];
    const size = PIECE_SIZES[5 + Math.floor(random() * 5)];
    list.push({
      id: `from-${g.garmentId}-${k + 1}`,
      width: size.w,
      height: size.h,
      count: 1 + Math.floor(random() * 3),
      source: { kind: 'garment', garmentId: g.garmentId },
    });
  }
  const group = raw.filter((g) => g.kind === 'shirt').map((g) => g.garmentId);
  if (group.length >= 2) {
    list.push({ id: 'shirts-only', width: 4.5, height: 4.5, count: 4 + Math.floor(random() * 8), source: { kind: 'garment-group', name: 'the shirts', garmentIds: group } });
  }
  return { name, realistic: true, input: { panels, pieces: list } };
}

function perfectSheet(name: string, seed: number, side: number, count: number): Instance {
  const inst = perfectInstance(seed, side, side, count);
  return {
    name,
    realistic: false,
    input: {
      panels: [{ garmentId: 'sheet', panelId: 'sheet', width: inst.width, height: inst.height }],
      pieces: inst.pieces.map((p, i) => ({ id: `p${i + 1}`, width: p.width, height: p.height, count: 1 })),
    },
  };
}

export const INSTANCES: Instance[] = [
  realisticInstance('cushion set, 10 g / 50 p', 101, 10, 50, 1.2),
  realisticInstance('baby quilt, 12 g / 80 p', 102, 12, 80, 0.8),
  realisticInstance('lap quilt, 18 g / 150 p', 103, 18, 150, 1.1),
  realisticInstance('throw, 24 g / 250 p', 104, 24, 250, 1.3),
  realisticInstance('single, 30 g / 400 p', 105, 30, 400, 0.9),
  realisticInstance('double, 40 g / 600 p', 106, 40, 600, 1.15),
  realisticInstance('queen, 50 g / 800 p', 107, 50, 800, 1.0),
  realisticInstance('king, 60 g / 1000 p', 108, 60, 1000, 1.1),
  perfectSheet('perfect 40 x 40 / 30 p', 201, 40, 30),
  perfectSheet('perfect 60 x 60 / 50 p', 202, 60, 50),
  perfectSheet('perfect 100 x 100 / 100 p', 203, 100, 100),
];
