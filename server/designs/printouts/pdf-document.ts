import { Length, formatCutSize, formatFinishedSize, type UnitSystem } from '@keepstitch/shared';

export { newDocument, toBuffer, PAPER_SIZES, PT_PER_MM, type Paper } from '../../core/pdf';

/** The heading every printout carries: what it is, the commission, the design version and the date. */
export function heading(doc: PDFKit.PDFDocument, title: string, lines: string[]): void {
  doc.font('Lato-Bold').fontSize(18).fillColor('#000').text(title, { continued: false });
  doc.font('Lato').fontSize(10).fillColor('#333');
  for (const l of lines) doc.text(l);
  doc.moveDown(0.6);
  doc.fillColor('#000');
}

export { today } from '../../core/calendar';

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
