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
import { INTERACTIVE_BUDGET_MS, THOROUGH_BUDGET_MS } from '../shared/src/cut-plan/cut-plan';
import { exactGuillotine } from '../shared/src/cut-plan/exact-guillotine';
import { checkPlan } from '../shared/src/cut-plan/plan-checker';
import { perfectInstance, seededRandom } from '../shared/src/cut-plan/perfect-instance';
import { INSTANCES, type Instance } from './bench-cut-plan-instances';

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
  for (const r of rows) {
    const name = r.inst.name;
    checks.push([
      `${name}: planner ${pct(r.planner.outcome.area / r.fabric)} >= maxrects-packer ${pct(r.maxrects.outcome.area / r.fabric)} and > potpack ${pct(r.potpack.outcome.area / r.fabric)}`,
      r.planner.outcome.area >= r.maxrects.outcome.area && r.planner.outcome.area > r.potpack.outcome.area,
    ]);
  }
  // 40 generated guillotine perfect packings, 15 to 100 pieces, at the printing budget.
  console.log('');
  console.log(`40 perfect packings (the project's recursive-cut construction), planner at ${THOROUGH_BUDGET_MS} ms budget, maxrects-packer alongside:`);
  let fillSum = 0;
  let full = 0;
  let perfectFaults = 0;
  for (let i = 0; i < 40; i++) {
    const seed = 301 + i;
    const count = 15 + Math.round((i * 85) / 39);
    const side = 40 + 2 * Math.round(count / 2);
    const inst = perfectInstance(seed, side, side, count);
    const input: CutPlanInput = {
      panels: [{ garmentId: 'sheet', panelId: 'sheet', width: side, height: side }],
      pieces: inst.pieces.map((p, k) => ({ id: `p${k + 1}`, width: p.width, height: p.height, count: 1 })),
    };
    const plan = planCuts(input, { budgetMs: THOROUGH_BUDGET_MS });
    perfectFaults += checkPlan(input, plan).length;
    const fill = plan.totals.yield;
    fillSum += fill;
    if (fill >= 1 - 1e-12) full++;
    console.log(`  seed ${seed}, ${side} x ${side}, ${count} pieces: planner ${pct(fill)}, maxrects ${pct(runMaxRects(input).area / (side * side))}`);
  }
  checks.push([`40 perfect packings: mean fill ${pct(fillSum / 40)} >= 99.5%`, fillSum / 40 >= 0.995]);
  checks.push([`40 perfect packings: ${full} filled 100% (>= 20)`, full >= 20]);
  checks.push([`40 perfect packings: every plan passes the checker`, perfectFaults === 0]);

  // The gap to the optimum on 30 small one-panel instances, by the exact solver.
  console.log('');
  console.log(`30 small one-panel instances: planner (${INTERACTIVE_BUDGET_MS} ms budget) against the exact guillotine optimum:`);
  let worst = 0;
  let proven = 0;
  const random = seededRandom(777);
  for (let k = 0; k < 30; k++) {
    const W = 10 + Math.floor(random() * 11);
    const H = 10 + Math.floor(random() * 11);
    const n = 5 + Math.floor(random() * 4);
    const sizes = Array.from({ length: n }, () => ({ w: 1 + Math.floor(random() * (W / 2)), h: 1 + Math.floor(random() * (H / 2)) }));
    const input: CutPlanInput = {
      panels: [{ garmentId: 'g', panelId: 'g', width: W, height: H }],
      pieces: sizes.map((p, i) => ({ id: `p${i + 1}`, width: p.w, height: p.h, count: 1 })),
    };
    const plan = planCuts(input, { budgetMs: INTERACTIVE_BUDGET_MS });
    // The exact solver need only beat the planner's area (whole square units here).
    const planned = Math.round(plan.totals.areaPlaced);
    const exact = exactGuillotine(W, H, sizes.map((p) => ({ w: p.w, h: p.h, turn: true })), 1_000_000, planned);
    const optimum = Math.max(exact.area, planned) / (W * H);
    const gap = (optimum - plan.totals.yield) * 100;
    if (exact.proven) {
      proven++;
      worst = Math.max(worst, gap);
    }
    console.log(
      `  ${W} x ${H}, ${n} pieces: planner ${pct(plan.totals.yield)}, ` +
        (exact.proven ? `optimum ${pct(optimum)} (proven), gap ${gap.toFixed(2)} points` : `best known ${pct(optimum)}, not proven within the exact solver's node limit`),
    );
  }
  checks.push([`30 small instances: largest gap to a proven optimum ${worst.toFixed(2)} points <= 1 (${proven} of 30 proven)`, worst <= 1 && proven === 30]);

  for (const [text, ok] of checks) console.log(`${ok ? 'PASS' : 'FAIL'}  ${text}`);
  if (checks.some(([, ok]) => !ok)) process.exitCode = 1;
}

main();
