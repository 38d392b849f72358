import { Length, formatCutSize, type Template } from '@keepstitch/shared';
import { PAPER_SIZES, PT_PER_MM, newDocument, toBuffer, today, type Paper } from './pdf-document';
import type { PrintableDesign } from './printable';

/** Overlap between neighbouring tiles of a template larger than one page: 1/2 in. */
export const TILE_OVERLAP_PT = 36;
const MARGIN = 36;
const HEAD = 64;
const FOOT = 104;
/** 2.5 cm in points. */
export const CM25_PT = 25 * PT_PER_MM;

interface Path {
  points: [number, number][];
  kind: 'cut' | 'finished';
}

/** A template's outlines in points, y down, with its top-left at (0, 0). */
export function templatePaths(t: Template): { paths: Path[]; width: number; height: number; grain: [[number, number], [number, number]] } {
  let raw: Path[];
  if (t.kind === 'blade') {
    raw = [
      { kind: 'cut', points: t.cut.map((p) => [p.x, p.y] as [number, number]) },
      { kind: 'finished', points: t.finished.map((p) => [p.x, p.y] as [number, number]) },
    ];
  } else if (t.kind === 'circle') {
    const ring = (r: number): [number, number][] => Array.from({ length: 181 }, (_, i) => [r * Math.cos((i * Math.PI) / 90), r * Math.sin((i * Math.PI) / 90)]);
    raw = [
      { kind: 'cut', points: ring(t.fabricRadiusMm) },
      { kind: 'finished', points: ring(t.cardRadiusMm) },
    ];
  } else {
    const s = t.allowanceMm;
    const arc = (r: number): [number, number][] => Array.from({ length: 91 }, (_, i) => [r * Math.cos((i * Math.PI) / 180), r * Math.sin((i * Math.PI) / 180)]);
    raw = [
      { kind: 'cut', points: [[-s, -s], [t.fabricRadiusMm, -s], ...arc(t.fabricRadiusMm), [-s, t.fabricRadiusMm], [-s, -s]] },
      { kind: 'finished', points: [[0, 0], ...arc(t.cardRadiusMm), [0, 0]] },
    ];
  }
  const all = raw.flatMap((p) => p.points);
  const minX = Math.min(...all.map((p) => p[0]));
  const maxX = Math.max(...all.map((p) => p[0]));
  const minY = Math.min(...all.map((p) => p[1]));
  const maxY = Math.max(...all.map((p) => p[1]));
  // mm with y up -> points with y down.
  const toPt = ([x, y]: [number, number]): [number, number] => [(x - minX) * PT_PER_MM, (maxY - y) * PT_PER_MM];
  const paths = raw.map((p) => ({ kind: p.kind, points: p.points.map(toPt) }));
  const cx = t.kind === 'quarter-circle' ? t.cardRadiusMm / 2 : (minX + maxX) / 2;
  const grain: [[number, number], [number, number]] = [toPt([cx, minY + (maxY - minY) * 0.2]), toPt([cx, minY + (maxY - minY) * 0.8])];
  return { paths, width: (maxX - minX) * PT_PER_MM, height: (maxY - minY) * PT_PER_MM, grain };
}

function sizeText(t: Template): string {
  return t.sizeText.map((s) => `${s.label} ${formatCutSize(Length.millimetres(s.mm))} (${formatCutSize(Length.millimetres(s.mm), 'metric', 'mm')})`).join('; ');
}

function checkSquares(doc: PDFKit.PDFDocument, pageH: number): void {
  const y = pageH - MARGIN - 84;
  doc.save().lineWidth(0.75).strokeColor('#000');
  doc.rect(MARGIN, y, 72, 72).stroke();
  doc.rect(MARGIN + 200, y, CM25_PT, CM25_PT).stroke();
  doc.restore();
  doc.font('Lato').fontSize(8).fillColor('#000');
  doc.text('1 in check square', MARGIN + 78, y + 2, { width: 110 });
  doc.text('Print at 100% ("actual size"). Measure this square: it must be exactly 1 in.', MARGIN + 78, y + 14, { width: 110 });
  doc.text('2.5 cm check square', MARGIN + 200 + CM25_PT + 6, y + 2, { width: 140 });
  doc.text('It must be exactly 2.5 cm on each side.', MARGIN + 200 + CM25_PT + 6, y + 14, { width: 140 });
}

function drawTemplate(doc: PDFKit.PDFDocument, shape: ReturnType<typeof templatePaths>): void {
  for (const p of shape.paths) {
    doc.save();
    if (p.kind === 'finished') doc.dash(4, { space: 3 }).lineWidth(0.6);
    else doc.lineWidth(1.2);
    const [first, ...rest] = p.points;
    doc.moveTo(first![0], first![1]);
    for (const q of rest) doc.lineTo(q[0], q[1]);
    doc.closePath().stroke();
    doc.restore();
  }
  // Grain arrow.
  const [[x1, y1], [x2, y2]] = shape.grain;
  doc.save().lineWidth(0.8).moveTo(x1, y1).lineTo(x2, y2).stroke();
  doc.moveTo(x2 - 4, y2 + 7).lineTo(x2, y2).lineTo(x2 + 4, y2 + 7).stroke();
  doc.moveTo(x1 - 4, y1 - 7).lineTo(x1, y1).lineTo(x1 + 4, y1 - 7).stroke();
  doc.restore();
  doc.font('Lato').fontSize(7).text('grain', x1 + 4, (y1 + y2) / 2, { lineBreak: false });
}

function crosses(doc: PDFKit.PDFDocument, xs: number[], ys: number[], width: number, height: number): void {
  doc.save().lineWidth(0.5).strokeColor('#c00');
  for (const x of xs) {
    for (let y = 36; y < height; y += 144) {
      doc.moveTo(x - 6, y).lineTo(x + 6, y).moveTo(x, y - 6).lineTo(x, y + 6).stroke();
    }
  }
  for (const y of ys) {
    for (let x = 36; x < width; x += 144) {
      doc.moveTo(x - 6, y).lineTo(x + 6, y).moveTo(x, y - 6).lineTo(x, y + 6).stroke();
    }
  }
  doc.restore();
}

/** Full-size templates at 1:1 (1 in = 72 pt), tiled with overlap marks when larger than a page. */
export async function templatesPdf(p: PrintableDesign, paper: Paper): Promise<Buffer> {
  const { commission, version } = p;
  const [pageW, pageH] = PAPER_SIZES[paper];
  const doc = newDocument(`Templates: ${commission.title}`, { paper });
  const areaW = pageW - 2 * MARGIN;
  const areaH = pageH - 2 * MARGIN - HEAD - FOOT;
  const templates = version.derived.templates;
  const head = (lines: string[]) => {
    doc.font('Lato-Bold').fontSize(13).fillColor('#000').text(lines[0]!, MARGIN, MARGIN, { width: areaW });
    doc.font('Lato').fontSize(8.5);
    for (const l of lines.slice(1)) doc.text(l, { width: areaW });
  };
  if (templates.length === 0) {
    head(['Templates', `${commission.title}, design version ${version.version}: this design has no curved pieces, so it needs no templates.`]);
    checkSquares(doc, pageH);
    return toBuffer(doc);
  }
  let firstPage = true;
  for (const t of templates) {
    const shape = templatePaths(t);
    const stepX = areaW - TILE_OVERLAP_PT;
    const stepY = areaH - TILE_OVERLAP_PT;
    const cols = shape.width <= areaW ? 1 : Math.ceil((shape.width - TILE_OVERLAP_PT) / stepX);
    const rows = shape.height <= areaH ? 1 : Math.ceil((shape.height - TILE_OVERLAP_PT) / stepY);
    const seamXs = Array.from({ length: cols - 1 }, (_, c) => (c + 1) * stepX + TILE_OVERLAP_PT / 2);
    const seamYs = Array.from({ length: rows - 1 }, (_, r) => (r + 1) * stepY + TILE_OVERLAP_PT / 2);
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        if (!firstPage) doc.addPage({ size: paper === 'a4' ? 'A4' : 'LETTER', margin: 40 });
        firstPage = false;
        const tiled = rows * cols > 1;
        head([
          `${t.name}${tiled ? `: tile ${r * cols + c + 1} of ${rows * cols} (row ${r + 1}, column ${c + 1})` : ''}`,
          `${commission.title}, design version ${version.version}, ${paper === 'a4' ? 'A4' : 'US Letter'}, printed ${today()}. Full size.`,
          `Solid line: cut line (seam allowance included). Dashed line: ${t.kind === 'blade' ? 'sewing line' : 'card template (finished edge)'}. ${sizeText(t)}`,
          tiled ? 'Tiles overlap by 1/2 in: lay each over its neighbour so the red crosses and the dashed overlap lines meet, then tape.' : '',
        ]);
        const ox = c * stepX;
        const oy = r * stepY;
        const x0 = MARGIN;
        const y0 = MARGIN + HEAD;
        doc.save();
        doc.rect(x0, y0, areaW, areaH).clip();
        doc.translate(x0 - ox, y0 - oy);
        drawTemplate(doc, shape);
        if (tiled) crosses(doc, seamXs, seamYs, shape.width, shape.height);
        doc.restore();
        if (tiled) {
          doc.save().lineWidth(0.5).dash(2, { space: 2 }).strokeColor('#c00');
          if (c > 0) doc.moveTo(x0 + TILE_OVERLAP_PT, y0).lineTo(x0 + TILE_OVERLAP_PT, y0 + areaH).stroke();
          if (c < cols - 1) doc.moveTo(x0 + areaW - TILE_OVERLAP_PT, y0).lineTo(x0 + areaW - TILE_OVERLAP_PT, y0 + areaH).stroke();
          if (r > 0) doc.moveTo(x0, y0 + TILE_OVERLAP_PT).lineTo(x0 + areaW, y0 + TILE_OVERLAP_PT).stroke();
          if (r < rows - 1) doc.moveTo(x0, y0 + areaH - TILE_OVERLAP_PT).lineTo(x0 + areaW, y0 + areaH - TILE_OVERLAP_PT).stroke();
          doc.restore();
        }
        checkSquares(doc, pageH);
      }
    }
  }
  return toBuffer(doc);
}
