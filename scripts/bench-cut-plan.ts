// Benchmark of the cut planner against two general-purpose packers,
// maxrects-packer and potpack, on the same instances in the same run.
//
//   npm run bench:cut-plan            (tsx scripts/bench-cut-plan.ts)
//
// Instances: a fixed, seeded set of memory quilts (10 to 60 garments with 2
// to 5 panels each, 50 to 1,000 pieces of the sizes such quilts use) and
// perfect-packing sheets cut by random guillotine cuts (100% fill possible).
// Yield = area of the pieces placed / area of the fabric offered.
// The peers do NOT keep the guillotine (edge-to-edge cut) rule, so they are
// peers for yield and speed, not for feasibility. Both are given the same
// source, turning and grain rules through the harness below.

import { MaxRectsBin, Rectangle } from 'maxrects-packer/dist/maxrects-packer.mjs';
import os from 'node:os';
import v8 from 'node:v8';
import { runInNewContext } from 'node:vm';
import { performance } from 'node:perf_hooks';
import potpack from 'potpack';
import { planCuts, type CutPlanInput, type GarmentPanelInput, type PieceInput } from '../shared/src/cut-plan/index';
import { perfectInstance, seededRandom } from '../shared/src/cut-plan/perfect-instance';
import { checkPlan } from '../shared/src/cut-plan/plan-checker';

// ---------------------------------------------------------------- instances

interface Instance {
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

const INSTANCES: Instance[] = [
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
const HEADLINE = 'king, 60 g / 1000 p';

// ---------------------------------------------------------------- the peers' harness

interface Outcome {
  placed: number;
  area: number;
  /** Copies placed per piece id. */
  byPiece?: Map<string, number>;
}

interface Copy {
  piece: PieceInput;
  w: number;
  h: number;
}

function copiesOf(input: CutPlanInput): Copy[] {
  return input.pieces.flatMap((piece) => Array.from({ length: piece.count }, () => ({ piece, w: piece.width, h: piece.height })));
}

function sourceAllows(piece: PieceInput, panel: GarmentPanelInput): boolean {
  const s = piece.source ?? { kind: 'any-garment' };
  if (s.kind === 'any-garment') return true;
  if (s.kind === 'garment') return s.garmentId === panel.garmentId;
  if (s.kind === 'garment-group') return s.garmentIds.includes(panel.garmentId);
  return false;
}

/** The ways a copy may lie in a panel: null if none; else its size and whether turning is free. */
function orientation(copy: Copy, panel: GarmentPanelInput): { w: number; h: number; turn: boolean } | null {
  let unturned = true;
  let turned = copy.piece.rotate !== false && !panel.directional;
  if (copy.piece.grain === 'lengthwise') {
    const grain = panel.grain ?? 'along-height';
    if (grain === 'along-height') turned = false;
    else if (grain === 'along-width') unturned = false;
    else unturned = turned = false;
  }
  if (unturned) return { w: copy.w, h: copy.h, turn: turned };
  if (turned) return { w: copy.h, h: copy.w, turn: false };
  return null;
}

const byArea = (a: GarmentPanelInput, b: GarmentPanelInput) => b.width * b.height - a.width * a.height;

/** Pieces that must come from particular garments are offered first, as the planner places them first. */
const restrictedFirst = (a: Copy, b: Copy) =>
  Number((b.piece.source?.kind ?? 'any-garment') !== 'any-garment') - Number((a.piece.source?.kind ?? 'any-garment') !== 'any-garment');

/**
 * maxrects-packer: one bin per panel, largest panels first; copies offered
 * restricted ones first, then longest side first (the library's own order).
 */
function runMaxRects(input: CutPlanInput): Outcome {
  const copies = copiesOf(input).sort(
    (a, b) => restrictedFirst(a, b) || Math.max(b.w, b.h) - Math.max(a.w, a.h) || b.w * b.h - a.w * a.h,
  );
  const taken = new Uint8Array(copies.length);
  const byPiece = new Map<string, number>();
  let placed = 0;
  let area = 0;
  for (const panel of [...input.panels].sort(byArea)) {
    const bin = new MaxRectsBin(panel.width, panel.height, 0, { smart: false, pot: false, square: false, allowRotation: false });
    copies.forEach((copy, i) => {
      if (taken[i] || !sourceAllows(copy.piece, panel)) return;
      const way = orientation(copy, panel);
      if (!way) return;
      if (!((way.w <= panel.width && way.h <= panel.height) || (way.turn && way.h <= panel.width && way.w <= panel.height))) return;
      const rect = new Rectangle(way.w, way.h, 0, 0, false, way.turn);
      if (bin.add(rect)) {
        taken[i] = 1;
        placed++;
        area += copy.w * copy.h;
        byPiece.set(copy.piece.id, (byPiece.get(copy.piece.id) ?? 0) + 1);
      }
    });
  }
  return { placed, area, byPiece };
}

/**
 * potpack packs into one near-square box of its own choosing, so per panel it
 * is given the largest remaining copies up to the panel's area (restricted
 * ones first), in a space
 * stretched so the panel is square (stretching keeps a packing valid); the
 * copies that land inside the panel are kept.
 */
function runPotpack(input: CutPlanInput): Outcome {
  const copies = copiesOf(input).sort((a, b) => restrictedFirst(a, b) || b.w * b.h - a.w * a.h);
  const taken = new Uint8Array(copies.length);
  let placed = 0;
  let area = 0;
  for (const panel of [...input.panels].sort(byArea)) {
    const stretch = panel.height / panel.width;
    const boxes: { w: number; h: number; x?: number; y?: number; i: number; cw: number; ch: number }[] = [];
    let sum = 0;
    copies.forEach((copy, i) => {
      if (taken[i] || !sourceAllows(copy.piece, panel)) return;
      const way = orientation(copy, panel);
      if (!way || way.w > panel.width || way.h > panel.height || sum + copy.w * copy.h > panel.width * panel.height) return;
      sum += copy.w * copy.h;
      boxes.push({ w: way.w * stretch, h: way.h, i, cw: way.w, ch: way.h });
    });
    potpack(boxes);
    for (const b of boxes) {
      const x = (b.x ?? 0) / stretch;
      if (x + b.cw <= panel.width + 1e-9 && (b.y ?? 0) + b.ch <= panel.height + 1e-9) {
        taken[b.i] = 1;
        placed++;
        area += b.cw * b.ch;
      }
    }
  }
  return { placed, area };
}

function runPlanner(input: CutPlanInput): Outcome {
  const plan = planCuts(input);
  return { placed: plan.totals.piecesPlaced, area: plan.totals.areaPlaced };
}

// ---------------------------------------------------------------- measuring

// A full garbage collection before measuring memory (node's --expose-gc, set at run time).
v8.setFlagsFromString('--expose-gc');
const collectGarbage = runInNewContext('gc') as () => void;

interface Memory {
  rss: number;
  heap: number;
}
const peak: Memory = { rss: 0, heap: 0 };
function sampleMemory(): void {
  const m = process.memoryUsage();
  peak.rss = Math.max(peak.rss, m.rss);
  peak.heap = Math.max(peak.heap, m.heapUsed);
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/**
 * Times the three packers on one instance, taking turns run by run so that
 * all three see the same machine load; returns each one's median.
 */
function timeTogether(runs: (() => Outcome)[], repeats: number): { outcome: Outcome; ms: number }[] {
  const outcomes = runs.map((run) => run()); // warm-up, also the results
  const times: number[][] = runs.map(() => []);
  for (let r = 0; r < repeats; r++) {
    runs.forEach((run, i) => {
      const t0 = performance.now();
      run();
      times[i].push(performance.now() - t0);
    });
  }
  return outcomes.map((outcome, i) => ({ outcome, ms: median(times[i]) }));
}

const MB = 2 ** 20;
const fabricArea = (input: CutPlanInput) => input.panels.reduce((s, p) => s + p.width * p.height, 0);
const pct = (x: number) => `${(x * 100).toFixed(1)}%`;
const pad = (s: string | number, n: number) => String(s).padStart(n);

interface Row {
  inst: Instance;
  count: number;
  fabric: number;
  planner: { outcome: Outcome; ms: number };
  maxrects: { outcome: Outcome; ms: number };
  potpack: { outcome: Outcome; ms: number };
  faults: number;
}

function main(): void {
  const repeats = Number(process.env.BENCH_REPEATS ?? 15);
  console.log(
    `Cut planner benchmark, ${new Date().toISOString()}, Node ${process.version}, ${os.cpus().length} cores, ` +
      `load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')}; median of ${repeats} runs after a warm-up, the three packers taking turns`,
  );
  console.log('Yield = area of pieces placed / area of fabric offered.');
  console.log('NOTE: the peers do NOT keep the guillotine (edge-to-edge cut) rule: they are peers for yield and speed, not for feasibility.');
  console.log('The peers get the same source, turning and grain rules, and restricted pieces first, through this script\'s harness.');
  console.log('');

  // Memory: the planner alone, from a cold start, before any peer has run.
  collectGarbage();
  const base = process.memoryUsage();
  peak.rss = base.rss;
  peak.heap = base.heapUsed;
  for (const inst of INSTANCES) {
    for (let r = 0; r < 3; r++) {
      runPlanner(inst.input);
      sampleMemory();
    }
  }
  const plannerPeak = { ...peak };

  // Warm every code path up, so no instance is timed on cold code.
  for (const inst of INSTANCES) {
    runPlanner(inst.input);
    runMaxRects(inst.input);
    runPotpack(inst.input);
  }

  // Time: the three take turns on each instance.
  const rows: Row[] = INSTANCES.map((inst) => {
    const [planner, maxrects, potpack] = timeTogether(
      [() => runPlanner(inst.input), () => runMaxRects(inst.input), () => runPotpack(inst.input)],
      repeats,
    );
    return {
      inst,
      count: inst.input.pieces.reduce((s, p) => s + p.count, 0),
      fabric: fabricArea(inst.input),
      planner,
      maxrects,
      potpack,
      faults: checkPlan(inst.input, planCuts(inst.input)).length,
    };
  });

  console.log(
    `${'instance'.padEnd(28)}${pad('panels', 7)}${pad('pieces', 7)} | ${pad('planner', 8)}${pad('yield', 7)}${pad('ms', 8)} | ${pad('maxrects', 8)}${pad('yield', 7)}${pad('ms', 8)} | ${pad('potpack', 8)}${pad('yield', 7)}${pad('ms', 8)} | ${pad('t p/mr', 7)}${pad('t p/pp', 7)}${pad('y p-mr', 8)} checker`,
  );
  const line = (name: string, panels: string | number, count: number, r: Omit<Row, 'inst' | 'count' | 'faults'>, check: string) =>
    console.log(
      `${name.padEnd(28)}${pad(panels, 7)}${pad(count, 7)} | ` +
        `${pad(r.planner.outcome.placed, 8)}${pad(pct(r.planner.outcome.area / r.fabric), 7)}${pad(r.planner.ms.toFixed(2), 8)} | ` +
        `${pad(r.maxrects.outcome.placed, 8)}${pad(pct(r.maxrects.outcome.area / r.fabric), 7)}${pad(r.maxrects.ms.toFixed(2), 8)} | ` +
        `${pad(r.potpack.outcome.placed, 8)}${pad(pct(r.potpack.outcome.area / r.fabric), 7)}${pad(r.potpack.ms.toFixed(2), 8)} | ` +
        `${pad((r.planner.ms / r.maxrects.ms).toFixed(2), 7)}${pad((r.planner.ms / r.potpack.ms).toFixed(2), 7)}` +
        `${pad((((r.planner.outcome.area - r.maxrects.outcome.area) / r.fabric) * 100).toFixed(1), 8)} ${check}`,
    );
  for (const r of rows) line(r.inst.name, r.inst.input.panels.length, r.count, r, r.faults === 0 ? 'valid' : `${r.faults} faults`);
  console.log('');
  const sum = (list: Row[]) => {
    const add = (pick: (r: Row) => { outcome: Outcome; ms: number }) => ({
      outcome: { placed: list.reduce((s, r) => s + pick(r).outcome.placed, 0), area: list.reduce((s, r) => s + pick(r).outcome.area, 0) },
      ms: list.reduce((s, r) => s + pick(r).ms, 0),
    });
    return { fabric: list.reduce((s, r) => s + r.fabric, 0), planner: add((r) => r.planner), maxrects: add((r) => r.maxrects), potpack: add((r) => r.potpack) };
  };
  const realistic = rows.filter((r) => r.inst.realistic);
  const perfect = rows.filter((r) => !r.inst.realistic);
  const totalRealistic = sum(realistic);
  line('total, memory quilts', '', realistic.reduce((s, r) => s + r.count, 0), totalRealistic, '');
  line('total, perfect packings', '', perfect.reduce((s, r) => s + r.count, 0), sum(perfect), '');
  console.log(
    `planner memory: peak rss ${(plannerPeak.rss / MB).toFixed(1)} MB (process, tsx included; ${(base.rss / MB).toFixed(1)} MB before planning), ` +
      `peak heap ${(plannerPeak.heap / MB).toFixed(1)} MB (${((plannerPeak.heap - base.heapUsed) / MB).toFixed(1)} MB above the ${(base.heapUsed / MB).toFixed(1)} MB before planning)`,
  );
  console.log('');

  const headline = rows.find((r) => r.inst.name === HEADLINE) as Row;
  const valid = rows.every((r) => r.faults === 0);
  const yP = totalRealistic.planner.outcome.area / totalRealistic.fabric;
  const yM = totalRealistic.maxrects.outcome.area / totalRealistic.fabric;
  const checks: [string, boolean][] = [
    [`memory-quilt total yield ${pct(yP)} >= maxrects-packer's ${pct(yM)}, with every cut edge to edge`, yP >= yM && valid],
    [`${HEADLINE}: planner median ${headline.planner.ms.toFixed(2)} ms <= 100 ms`, headline.planner.ms <= 100],
    [
      `${HEADLINE}: planner ${headline.planner.ms.toFixed(2)} ms <= half of maxrects-packer's ${headline.maxrects.ms.toFixed(2)} ms (ratio ${(headline.planner.ms / headline.maxrects.ms).toFixed(2)})`,
      headline.planner.ms <= headline.maxrects.ms / 2,
    ],
    [
      `planner memory ${((plannerPeak.rss - base.rss) / MB).toFixed(1)} MB of rss above the process before planning (heap ${((plannerPeak.heap - base.heapUsed) / MB).toFixed(1)} MB) < 100 MB`,
      plannerPeak.rss - base.rss < 100 * MB,
    ],
    ['every planner plan passes the independent checker', valid],
  ];
  for (const [text, ok] of checks) console.log(`${ok ? 'PASS' : 'FAIL'}  ${text}`);
  if (checks.some(([, ok]) => !ok)) process.exitCode = 1;
}

main();
