import { contentFigures, templateOutline, wordsText, type Block, type CheckSquaresFigure, type PrintoutContent, type Template } from '@keepstitch/shared';
import { PAPER_SIZES, PT_PER_MM, type Paper } from './pdf-document';

/** Overlap between neighbouring tiles of a template larger than one page: 1/2 in. */
export const TILE_OVERLAP_PT = 36;
const MARGIN = 36;
const HEAD = 64;
const FOOT = 104;

interface Path {
  points: [number, number][];
  kind: 'cut' | 'finished';
}

/** A template's outlines in points, y down, with its top-left at (0, 0): the shared outline at 1 mm = 72 / 25.4 pt. */
export function templatePaths(t: Template): { paths: Path[]; width: number; height: number; grain: [[number, number], [number, number]] } {
  const o = templateOutline(t);
  const pt = ([x, y]: readonly [number, number]): [number, number] => [x * PT_PER_MM, y * PT_PER_MM];
  return {
    paths: [
      { kind: 'cut', points: o.cut.map(pt) },
      { kind: 'finished', points: o.inner.map(pt) },
    ],
    width: o.widthMm * PT_PER_MM,
    height: o.heightMm * PT_PER_MM,
    // From the lower end to the upper, as the arrowheads are drawn.
    grain: [pt([o.grain.x2, o.grain.y2]), pt([o.grain.x1, o.grain.y1])],
  };
}

/** The check squares at the foot of a sheet: each square at its size in millimetres, its name and how to read it beside it. */
function checkSquares(doc: PDFKit.PDFDocument, pageH: number, checks: CheckSquaresFigure | undefined): void {
  if (!checks) return;
  const y = pageH - MARGIN - 84;
  const slots = [
    { x: MARGIN, width: 110 },
    { x: MARGIN + 200, width: 140 },
  ];
  checks.squares.forEach((sq, i) => {
    const slot = slots[i] ?? { x: MARGIN + 200 * i, width: 110 };
    const side = sq.mm * PT_PER_MM;
    doc.save().lineWidth(0.75).strokeColor('#000').rect(slot.x, y, side, side).stroke().restore();
    doc.font('Lato').fontSize(8).fillColor('#000');
    doc.text(sq.label, slot.x + side + 6, y + 2, { width: slot.width });
    doc.text(sq.text, slot.x + side + 6, y + 14, { width: slot.width });
  });
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

/**
 * A printout laid out in sheets: each section with a full-size template is
 * drawn 1:1 (1 in = 72 pt) on sheets of its own, tiled with overlap marks when
 * larger than a page, its heading, the printout's lines and the section's
 * words at the head of each sheet and the check squares at its foot. A
 * printout with no template has one sheet of its words.
 */
export function drawSheets(doc: PDFKit.PDFDocument, content: PrintoutContent, paper: Paper): void {
  const [pageW, pageH] = PAPER_SIZES[paper];
  const areaW = pageW - 2 * MARGIN;
  const areaH = pageH - 2 * MARGIN - HEAD - FOOT;
  const checks = contentFigures(content).find((f): f is CheckSquaresFigure => f.kind === 'check-squares');
  const words = (blocks: readonly Block[]) => blocks.flatMap((b) => (b.kind === 'paragraph' && b.only !== 'page' ? [wordsText(b.text)] : []));
  const head = (lines: string[]) => {
    doc.font('Lato-Bold').fontSize(13).fillColor('#000').text(lines[0]!, MARGIN, MARGIN, { width: areaW });
    doc.font('Lato').fontSize(8.5);
    for (const l of lines.slice(1)) if (l) doc.text(l, { width: areaW });
  };
  const sheets = content.sections.flatMap((s) => s.blocks.flatMap((b) => (b.kind === 'figure' && b.figure.kind === 'template' ? [{ section: s, figure: b.figure }] : [])));
  if (sheets.length === 0) {
    head([content.title, ...content.meta, ...content.sections.flatMap((s) => words(s.blocks))]);
    checkSquares(doc, pageH, checks);
    return;
  }
  let firstPage = true;
  for (const { section, figure } of sheets) {
    const shape = templatePaths(figure.template);
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
        head([`${section.heading ?? content.title}${tiled ? `: tile ${r * cols + c + 1} of ${rows * cols} (row ${r + 1}, column ${c + 1})` : ''}`, ...content.meta, ...words(section.blocks), tiled ? figure.tiles : '']);
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
        checkSquares(doc, pageH, checks);
      }
    }
  }
}
