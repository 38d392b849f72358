import PDFDocument from 'pdfkit';
import { readFileSync } from 'node:fs';
import path from 'node:path';

const FONT_DIR = path.resolve(__dirname, '..', '..', 'node_modules', '@fontsource', 'lato', 'files');
let fonts: { regular: Buffer; bold: Buffer } | null = null;

/** Lato from the bundled font package, read once (pdfkit draws .woff; .woff2 would come out blank). */
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

/** A new document with Lato registered as "Lato" and "Lato-Bold". */
export function newDocument(title: string, options: { paper?: Paper; margin?: number; author?: string } = {}): PDFKit.PDFDocument {
  const doc = new PDFDocument({
    size: options.paper === 'letter' ? 'LETTER' : 'A4',
    margin: options.margin ?? 40,
    info: { Title: title, Author: options.author ?? 'Keepstitch', Producer: 'Keepstitch', Creator: 'Keepstitch' },
  });
  const f = lato();
  doc.registerFont('Lato', f.regular);
  doc.registerFont('Lato-Bold', f.bold);
  doc.font('Lato');
  return doc;
}

/** Ends a document and collects its bytes. */
export function toBuffer(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
