import PDFDocument from 'pdfkit';
import path from 'node:path';

const FONT_DIR = path.resolve(__dirname, '..', '..', 'node_modules', '@fontsource', 'lato', 'files');
/** Lato from the bundled font package (pdfkit draws .woff; .woff2 would come out blank). */
export const LATO = path.join(FONT_DIR, 'lato-latin-400-normal.woff');
export const LATO_BOLD = path.join(FONT_DIR, 'lato-latin-700-normal.woff');

/** A new A4 document with Lato registered as "body" and "bold". 1 in = 72 pt. */
export function newDocument(info: { title: string; author?: string }, size: 'A4' | 'LETTER' = 'A4'): PDFKit.PDFDocument {
  const doc = new PDFDocument({ size, margin: 56, info: { Title: info.title, Author: info.author ?? 'Keepstitch', Creator: 'Keepstitch' }, bufferPages: true });
  doc.registerFont('body', LATO);
  doc.registerFont('bold', LATO_BOLD);
  doc.font('body');
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
