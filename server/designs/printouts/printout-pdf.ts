import type { Block, ListItem, PanelFigure, PrintoutContent, QuiltTopFigure, Section, Tone, Words } from '@keepstitch/shared';
import { ensureSpace, heading, newDocument, toBuffer, type Paper } from './pdf-document';
import { drawQuiltTop, drawTopKey, keptMark } from './quilt-top-pdf';
import { drawSheets } from './template-sheets-pdf';

const ALERT = '#8a1c1c';
const TONE_COLOUR: Record<Tone, string> = { note: '#7a3b00', alert: ALERT, quiet: '#333', small: '#555' };
const TONE_SIZE: Partial<Record<Tone, number>> = { quiet: 9, small: 8 };

/**
 * A printout as a PDF: the one renderer of every printout's content. Its
 * title and lines, then each section; or, for a printout laid out in sheets,
 * a sheet for each full-size template.
 */
export async function printoutPdf(content: PrintoutContent, options: { documentTitle: string; paper?: Paper }): Promise<Buffer> {
  const doc = newDocument(options.documentTitle, options.paper ? { paper: options.paper } : {});
  if (content.layout === 'sheets') {
    drawSheets(doc, content, options.paper ?? 'a4');
    return toBuffer(doc);
  }
  heading(doc, content.title, [...content.meta]);
  content.sections.forEach((s, i) => {
    if (i > 0) doc.moveDown(0.6);
    drawSection(doc, s);
  });
  return toBuffer(doc);
}

/** Words in the current font size, the bold runs in bold; `continued` leaves the line open. */
function words(doc: PDFKit.PDFDocument, text: Words, options: PDFKit.Mixins.TextOptions = {}, font = 'Lato'): void {
  const runs = typeof text === 'string' ? [{ text }] : text;
  runs.forEach((r, i) => doc.font(r.bold ? 'Lato-Bold' : font).text(r.text, { ...options, continued: i < runs.length - 1 }));
  doc.font('Lato');
}

function drawSection(doc: PDFKit.PDFDocument, section: Section): void {
  const first = section.blocks.find((b) => b.only !== 'page');
  ensureSpace(doc, first?.kind === 'figure' && first.figure.kind === 'quilt-top' ? 200 : section.blocks.some((b) => b.kind === 'figure') ? 120 : 90);
  if (section.heading) {
    doc.font('Lato-Bold').fontSize(13).fillColor(section.tone === 'alert' ? ALERT : '#000').text(section.heading).fillColor('#000');
  }
  let last: Block['kind'] | null = null;
  for (const b of section.blocks) {
    if (b.only === 'page') continue;
    if (b.kind === 'figure' && last !== null && last !== 'figure') doc.moveDown(0.4);
    drawBlock(doc, b);
    last = b.kind;
  }
}

function drawBlock(doc: PDFKit.PDFDocument, b: Block): void {
  doc.font('Lato').fontSize(10).fillColor('#000');
  switch (b.kind) {
    case 'paragraph':
      if (b.tone) doc.fillColor(TONE_COLOUR[b.tone]).fontSize(TONE_SIZE[b.tone] ?? 10);
      words(doc, b.text);
      doc.fillColor('#000');
      return;
    case 'list':
      b.items.forEach((item, i) => listItem(doc, item, b.style === 'bullets' ? '\u2022 ' : b.style === 'steps' ? `${i + 1}. ` : ''));
      return;
    case 'table':
      table(doc, b.head, b.rows);
      return;
    case 'group':
      doc.font('Lato-Bold').fontSize(10).text(b.heading);
      for (const inner of b.blocks) if (inner.only !== 'page') drawBlock(doc, inner);
      doc.moveDown(0.3);
      return;
    case 'figure':
      if (b.figure.kind === 'quilt-top') quiltTop(doc, b.figure);
      else if (b.figure.kind === 'panel') panel(doc, b.figure, b.title ?? '', b.beside ?? []);
      return;
  }
}

function listItem(doc: PDFKit.PDFDocument, item: ListItem, lead: string): void {
  const count = item.count !== undefined ? `  [${item.count}]` : '';
  const text: Words = typeof item.text === 'string' ? `${lead}${item.text}${count}` : [{ text: lead }, ...item.text, ...(count ? [{ text: count }] : [])];
  words(doc, text, { indent: lead.startsWith('\u2022') ? 6 : 8 }, item.emphasis ? 'Lato-Bold' : 'Lato');
  for (const n of item.notes ?? []) doc.font('Lato-Bold').text(`${n.label} `, { indent: 24, continued: true }).font('Lato').text(n.text);
}

function table(doc: PDFKit.PDFDocument, head: readonly string[], rows: readonly (readonly string[])[]): void {
  const left = doc.page.margins.left;
  const width = (doc.page.width - left - doc.page.margins.right) / Math.max(1, head.length);
  const row = (cells: readonly string[], bold: boolean) => {
    ensureSpace(doc, 16);
    const top = doc.y;
    let bottom = top;
    cells.forEach((c, i) => {
      doc.font(bold ? 'Lato-Bold' : 'Lato').text(c, left + i * width, top, { width: width - 6 });
      bottom = Math.max(bottom, doc.y);
    });
    doc.x = left;
    doc.y = bottom + 2;
  };
  row(head, true);
  for (const r of rows) row(r, false);
  doc.font('Lato');
}

/** The top beside its key. */
function quiltTop(doc: PDFKit.PDFDocument, f: QuiltTopFigure): void {
  const top = doc.y + 4;
  const left = doc.page.margins.left;
  const drawn = drawQuiltTop(doc, left, top, 200, 260, f.body, f.derived, f.fabrics, f.kept);
  const keyBottom = drawTopKey(doc, left + 216, top, doc.page.width - doc.page.margins.right - left - 216, f);
  doc.x = left;
  doc.y = Math.max(top + drawn, keyBottom) + 14;
}

/** A panel's diagram with its pieces, the kept feature marked, and its cuts beside it. */
function panel(doc: PDFKit.PDFDocument, f: PanelFigure, title: string, beside: readonly ListItem[]): void {
  ensureSpace(doc, 170);
  const top = doc.y;
  const left = doc.page.margins.left;
  doc.font('Lato-Bold').fontSize(10).text(title, left, top);
  const diagramTop = doc.y + 4;
  const maxW = 150;
  const maxH = 150;
  const scale = Math.min(maxW / f.width, maxH / f.height);
  doc.save();
  doc.lineWidth(0.5);
  doc.rect(left, diagramTop, f.width * scale, f.height * scale).fillAndStroke('#e6e6e6', '#000');
  const box = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]];
  for (const pl of f.pieces) {
    doc.rect(left + pl.x * scale, diagramTop + pl.y * scale, pl.width * scale, pl.height * scale).fillAndStroke(f.hex, '#000');
    if (pl.kept) {
      // The piece kept around a feature: marked, with the feature's outline where it lies on the panel.
      keptMark(doc, box(left + pl.x * scale, diagramTop + pl.y * scale, pl.width * scale, pl.height * scale), Math.min(pl.width, pl.height) * scale);
      if (pl.feature) {
        doc.save().lineWidth(0.6).dash(1.5, { space: 1 });
        doc.rect(left + pl.feature.x * scale, diagramTop + pl.feature.y * scale, pl.feature.width * scale, pl.feature.height * scale).stroke('#000');
        doc.undash().restore();
      }
    }
    const inset = pl.kept ? 3 : 1;
    doc.fillColor('#000').fontSize(6).text(pl.label, left + pl.x * scale + inset, diagramTop + pl.y * scale + inset, { lineBreak: false });
  }
  doc.restore();
  const textLeft = left + maxW + 14;
  doc.font('Lato').fontSize(8.5);
  doc.x = textLeft;
  doc.y = diagramTop;
  const width = doc.page.width - doc.page.margins.right - textLeft;
  for (const step of beside) {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 12) {
      doc.addPage();
      doc.x = textLeft;
    }
    doc.x = textLeft;
    words(doc, step.text, { width }, step.emphasis ? 'Lato-Bold' : 'Lato');
  }
  doc.x = left;
  doc.y = Math.max(doc.y, diagramTop + f.height * scale) + 12;
}
