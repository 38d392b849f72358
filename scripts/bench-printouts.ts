// Benchmark of the design printouts and the design screen's re-plan, on a
// fixed 500-piece design (no database: the same functions the routes call).
//
//   npm run bench:printouts           (tsx scripts/bench-printouts.ts)
//
// Targets (from the issue): the cut list PDF of a 500-piece design in 1 s or
// less (median), and deriving + planning that design in 300 ms or less.

import Decimal from 'decimal.js';
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { buildPrintout, deriveDesign, planDesign, printoutOf, type DesignBody, type DesignSources, type PrintableDesign } from '../shared/src/index';
import { printoutPdf } from '../server/designs/printouts/printout-pdf';

/** A printout's content and its PDF, as the route makes them. */
function printPdf(id: string, printable: PrintableDesign, paper?: 'a4' | 'letter'): Promise<Buffer> {
  const content = buildPrintout(printoutOf(id)!, printable as never, { printedOn: '2026-01-01', paper });
  return printoutPdf(content, { documentTitle: id, paper });
}

const inch = (n: number) => new Decimal(n).times('25.4').toString();

/** 30 garments of 4 panels each (shirt-sized), and two studio fabrics. */
function sources(): DesignSources {
  const garments = Array.from({ length: 30 }, (_, g) => ({
    id: g + 1,
    description: `Garment ${g + 1}`,
    colour: ['Pale blue', 'Green', 'Navy', 'Red stripe', 'Cream'][g % 5]!,
    fibre: 'cotton',
    construction: 'woven',
    print: g % 7 === 0 ? 'directional' : 'plain',
    panels: [
      [22 + (g % 3), 27 + (g % 4)],
      [10.5, 24],
      [10.5, 24],
      [9, 22 - (g % 3)],
    ].map(([w, h], i) => ({ id: (g + 1) * 10 + i, name: ['back', 'left front', 'right front', 'sleeve'][i]!, widthMm: inch(w!), heightMm: inch(h!), grain: 'vertical' as const })),
  }));
  return {
    garments,
    stock: [
      { id: 1, name: 'Calico', colour: 'Natural', fibre: 'cotton', widthMm: inch(108), lengthMm: '6000', costUnit: 'metre' },
      { id: 2, name: 'Navy', colour: 'Navy', fibre: 'cotton', widthMm: inch(44), lengthMm: '3500', costUnit: 'metre' },
    ],
  };
}

/** 11 x 9 blocks of 6 in with sashing: squares, HSTs and rails from the garments; sashing and border from stock. */
function design(): DesignBody {
  const assignments: DesignBody['assignments'] = [
    { target: { kind: 'piece', key: 'sashing' }, fabric: { kind: 'stock', stockId: 2 } },
    { target: { kind: 'piece', key: 'cornerstones' }, fabric: { kind: 'stock', stockId: 1 } },
    { target: { kind: 'piece', key: 'border:1' }, fabric: { kind: 'stock', stockId: 2 } },
    { target: { kind: 'piece', key: 'block:H:light' }, fabric: { kind: 'stock', stockId: 1 } },
  ];
  for (let i = 0; i < 99; i++) assignments.push({ target: { kind: 'position', index: i }, fabric: { kind: 'garment', garmentId: (i % 30) + 1 } });
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(80), lengthMm: inch(90) },
    layout: { setting: 'straight', rows: 11, columns: 9, blockMm: inch(6), sashing: { widthMm: inch(1.5), cornerstones: true }, borders: [inch(4)] },
    blocks: [
      { id: 'S', name: 'Square', kind: 'square' },
      { id: 'H', name: 'Triangles', kind: 'hst', units: 2 },
      { id: 'R', name: 'Rails', kind: 'rectangles', units: 3 },
    ],
    pattern: ['S', 'H', 'R'],
    assignments,
    finishing: { bindingStockId: 2, bindingStripMm: inch(2.5), backingStockId: 1, waddingStockId: null, prewash: true, shrinkPercent: '3' },
    rules: { minimumPerGarment: 2 },
  };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
}

async function main(): Promise<void> {
  const body = design();
  const src = sources();
  const runs = 9;
  const replan: number[] = [];
  let derived = deriveDesign(body);
  let plan = planDesign(body, derived, src);
  for (let i = 0; i < runs + 2; i++) {
    const t0 = performance.now();
    derived = deriveDesign(body);
    plan = planDesign(body, derived, src);
    if (i >= 2) replan.push(performance.now() - t0);
  }
  const printable: PrintableDesign = { commission: { id: 1, title: 'Benchmark quilt' }, version: { version: 1, body, derived, plan }, garments: src.garments, stock: src.stock, fabrics: [] };
  const pdfTimes: number[] = [];
  let bytes = 0;
  for (let i = 0; i < runs + 2; i++) {
    const t0 = performance.now();
    const pdf = await printPdf('cut-list', printable);
    if (i >= 2) pdfTimes.push(performance.now() - t0);
    bytes = pdf.length;
  }
  const t0 = performance.now();
  await printPdf('templates', printable, 'a4');
  const templatesMs = performance.now() - t0;

  console.log(`Printouts benchmark on ${os.cpus()[0]?.model ?? 'this machine'} (${os.cpus().length} cores), Node ${process.version}`);
  console.log(`Design: ${derived.totals.blocks} blocks, ${derived.totals.pieces} pieces (${derived.pieces.length} piece lines); placed ${plan.totals.piecesPlaced}, short ${plan.totals.piecesShort}; ${plan.plan.panels.filter((p) => p.piecesCut > 0).length} panels cut`);
  console.log(`Re-derive and re-plan: median ${median(replan).toFixed(1)} ms, max ${Math.max(...replan).toFixed(1)} ms over ${runs} runs (target <= 300 ms) ${median(replan) <= 300 ? 'MET' : 'NOT MET'}`);
  console.log(`Cut list PDF: median ${median(pdfTimes).toFixed(1)} ms, max ${Math.max(...pdfTimes).toFixed(1)} ms over ${runs} runs, ${(bytes / 1024).toFixed(0)} KB (target <= 1000 ms) ${median(pdfTimes) <= 1000 ? 'MET' : 'NOT MET'}`);
  console.log(`Templates PDF (no curved blocks here, one page): ${templatesMs.toFixed(1)} ms`);
  if (derived.totals.pieces < 500) console.log(`WARNING: the design has fewer than 500 pieces (${derived.totals.pieces}).`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
