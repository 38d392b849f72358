import { designDrawing, keptFeatureOutline, type DesignBody, type DesignDerivation, type KeptFeaturePlace, type KeyFabric, type QuiltTopFigure } from '@keepstitch/shared';

type Legend = readonly KeyFabric[];
type Point = [number, number];

/** The hatching of a shape the planner fills from any garment, as the app draws it. */
const ANY_FABRIC = ['#f1efe8', '#d8d3c4'];

/** Fills a closed outline with stripes at 45 degrees, `width` points each, cycling through the colours. */
export function fillStriped(doc: PDFKit.PDFDocument, outline: readonly Point[], stripes: readonly string[], width: number): void {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const cx = (Math.min(...xs) + Math.max(...xs)) / 2;
  const cy = (Math.min(...ys) + Math.max(...ys)) / 2;
  const reach = Math.hypot(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) / 2 + width;
  doc.save();
  doc.polygon(...outline.map((p) => [...p])).clip();
  doc.rotate(45, { origin: [cx, cy] });
  let i = 0;
  for (let x = cx - reach; x < cx + reach; x += width, i++) doc.rect(x, cy - reach, width, 2 * reach).fill(stripes[i % stripes.length]!);
  doc.restore();
}

/** Fills an outline with a fabric of the legend: its colour, a group's stripes, or the planner's hatching. */
export function fillFabric(doc: PDFKit.PDFDocument, outline: readonly Point[], key: string, legend: Legend, stripeWidth: number): void {
  const item = legend.find((f) => f.key === key);
  const stripes = item?.stripes ?? (item ? null : ANY_FABRIC);
  if (stripes && stripes.length > 1) fillStriped(doc, outline, stripes, stripeWidth);
  else doc.polygon(...outline.map((p) => [...p])).fill(stripes?.[0] ?? item?.hex ?? ANY_FABRIC[0]!);
}

/** The mark on a piece that holds a kept feature: a dashed outline over a white halo, and a ringed dot at its middle (reads in black and white). */
export function keptMark(doc: PDFKit.PDFDocument, outline: readonly Point[], size: number): void {
  const pts = outline.map((p) => [...p]);
  doc.save();
  doc.lineWidth(2.4).polygon(...pts).stroke('#ffffff');
  doc.lineWidth(1.2).dash(2.5, { space: 1.5 }).polygon(...pts).stroke('#000000');
  doc.undash();
  const cx = outline.reduce((s, p) => s + p[0], 0) / outline.length;
  const cy = outline.reduce((s, p) => s + p[1], 0) / outline.length;
  const r = Math.max(1.5, Math.min(3, size / 6));
  doc.lineWidth(0.8).circle(cx, cy, r).fillAndStroke('#000000', '#ffffff');
  doc.restore();
}

/**
 * The quilt top to scale in a box `width` x `maxHeight` points from (x, y),
 * each shape in its fabric (a group in stripes of its garments' colours) and
 * each kept feature's piece marked. Returns the height drawn.
 */
export function drawQuiltTop(doc: PDFKit.PDFDocument, x: number, y: number, width: number, maxHeight: number, body: DesignBody, derived: DesignDerivation, legend: Legend, kept: readonly KeptFeaturePlace[]): number {
  const drawing = designDrawing(body, derived);
  const scale = Math.min(width / drawing.width, maxHeight / drawing.height);
  const at = (pts: readonly Point[]): Point[] => pts.map(([px, py]) => [x + px * scale, y + py * scale]);
  // Stripes 30 mm wide as the app draws them, but never thinner than 1.5 pt.
  const stripe = Math.max(1.5, 30 * scale);
  doc.save().lineWidth(0.3);
  for (const s of drawing.shapes) {
    const outline = at(s.points);
    fillFabric(doc, outline, s.fill, legend, stripe);
    doc.polygon(...outline.map((p) => [...p])).stroke('#3b3b3b');
  }
  for (const k of kept) {
    const outline = keptFeatureOutline(body, derived, k);
    if (outline) keptMark(doc, at(outline), Number(body.layout.blockMm) * scale);
  }
  doc.rect(x, y, drawing.width * scale, drawing.height * scale).lineWidth(0.6).stroke('#000000');
  doc.restore();
  return drawing.height * scale;
}

/** The key to the drawing from (x, y): each fabric it shows with its swatch, then each kept feature's mark. Returns the y below it. */
export function drawTopKey(doc: PDFKit.PDFDocument, x: number, y: number, width: number, top: QuiltTopFigure): number {
  const textX = x + 16;
  const textW = width - 16;
  doc.font('Lato').fontSize(8.5).fillColor('#000000');
  let line = y;
  const row = (swatch: (top: number) => void, text: string) => {
    swatch(line);
    doc.fillColor('#000000').text(text, textX, line, { width: textW });
    line = Math.max(doc.y, line + 11) + 2;
  };
  const square = (top: number): Point[] => [[x, top], [x + 10, top], [x + 10, top + 10], [x, top + 10]];
  for (const item of top.key) {
    row((t) => {
      fillFabric(doc, square(t), item.key, top.fabrics, 2.5);
      doc.save().lineWidth(0.4).polygon(...square(t)).stroke('#000000').restore();
    }, item.name);
  }
  for (const text of top.keptKey) {
    row((t) => {
      doc.save().rect(x, t, 10, 10).fill('#e6e6e6').restore();
      keptMark(doc, square(t), 10);
    }, text);
  }
  return line;
}
