import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

export interface PdfPath {
  paint: string;
  /** The fill colour in force (#rrggbb). */
  fill: string;
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PdfPage {
  width: number;
  height: number;
  text: { str: string; x: number; y: number }[];
  paths: PdfPath[];
}

/** Parses a PDF with pdfjs-dist in a child Node process (pdfjs is ESM-only). */
export function readPdf(pdf: Buffer): { pages: PdfPage[]; text: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'ks-pdf-'));
  try {
    const file = path.join(dir, 'doc.pdf');
    writeFileSync(file, pdf);
    const out = execFileSync(process.execPath, [path.join(__dirname, 'read-pdf.mjs'), file], { cwd: path.resolve(__dirname, '..', '..'), maxBuffer: 64 * 1024 * 1024 });
    const { pages } = JSON.parse(out.toString()) as { pages: PdfPage[] };
    return { pages, text: pages.map((p) => p.text.map((t) => t.str).join(' ')).join('\n') };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
