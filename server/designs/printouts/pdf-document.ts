import PDFDocument from 'pdfkit';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { Length, formatCutSize, formatFinishedSize, type UnitSystem } from '@keepstitch/shared';

const FONT_DIR = path.resolve(__dirname, '..', '..', '..', 'node_modules', '@fontsource', 'lato', 'files');
let fonts: { regular: Buffer; bold: Buffer } | null = null;

/** Lato from the bundled package (.woff: pdfkit draws .woff2 blank). */
function lato() {
  fonts ??= {
    regular: readFileSync(path.join(FONT_DIR, 'lato-latin-400-normal.woff')),
    bold: readFileSync(path.join(FONT_DIR, 'lato-latin-700-normal.woff')),
  };
  return fonts;
}

/** PDF points per millimetre: 1 in = 72 pt exactly, 1 in = 25.4 mm exactly. */
export const PT_PER_MM = 72 / 25.4;

export type Paper = 'a4' | 'letter';
export const PAPER_SIZES: Record<Paper, [number, number]> = { a4: [595.28, 841.89], letter: [612, 792] };

export function newDocument(title: string, paper: Paper = 'a4'): PDFKit.PDFDocument {
  const doc = new PDFDocument({ size: paper === 'a4' ? 'A4' : 'LETTER', margin: 40, info: { Title: title, Author: 'Keepstitch', Producer: 'Keepstitch', Creator: 'Keepstitch' }, bufferPages: false });
  const f = lato();
  doc.registerFont('Lato', f.regular);
  doc.registerFont('Lato-Bold', f.bold);
  doc.font('Lato');
  return doc;
}

export function toBuffer(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

/** The heading every printout carries: what it is, the commission, the design version and the date. */
export function heading(doc: PDFKit.PDFDocument, title: string, lines: string[]): void {
  doc.font('Lato-Bold').fontSize(18).fillColor('#000').text(title, { continued: false });
  doc.font('Lato').fontSize(10).fillColor('#333');
  for (const l of lines) doc.text(l);
  doc.moveDown(0.6);
  doc.fillColor('#000');
}

export function today(): string {
  return new Date().toISOString().slice(0, 10);
}

/** Lengths in the design's units. */
export function measures(system: UnitSystem) {
  const metricUnit = 'cm' as const;
  return {
    cut: (mm: string | number) => formatCutSize(Length.millimetres(String(mm)), system, metricUnit),
    finished: (mm: string | number) => formatFinishedSize(Length.millimetres(String(mm)), system, metricUnit),
    /** Positions on a panel as measured: to the nearest mark. */
    at: (mm: string | number) => formatFinishedSize(Length.millimetres(String(mm)), system, metricUnit),
  };
}

/** Moves to a new page when less than `needed` points are left. */
export function ensureSpace(doc: PDFKit.PDFDocument, needed: number): void {
  if (doc.y + needed > doc.page.height - doc.page.margins.bottom) doc.addPage();
}
