// Reads a PDF with pdfjs-dist (an ES module, so run in its own Node process by
// the jest specs): every page's size, its text with positions, and the paths it
// draws with their bounding boxes in the page's user space (points, y up) and
// the fill colour in force when each was drawn.
// Usage: node server/testing/read-pdf.mjs file.pdf  -> JSON on stdout.
import { readFileSync } from 'node:fs';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';

const data = new Uint8Array(readFileSync(process.argv[2]));
const doc = await getDocument({ data, useSystemFonts: false, disableFontFace: true, verbosity: 0 }).promise;
const pages = [];
const names = Object.fromEntries(Object.entries(OPS).map(([k, v]) => [v, k]));
for (let n = 1; n <= doc.numPages; n++) {
  const page = await doc.getPage(n);
  const [x0, y0, x1, y1] = page.view;
  const text = await page.getTextContent();
  const ops = await page.getOperatorList();
  const paths = [];
  // The current transformation matrix, tracked through save/restore and transform.
  let ctm = [1, 0, 0, 1, 0, 0];
  let fill = '#000000';
  const stack = [];
  const mul = (m, t) => [m[0] * t[0] + m[2] * t[1], m[1] * t[0] + m[3] * t[1], m[0] * t[2] + m[2] * t[3], m[1] * t[2] + m[3] * t[3], m[0] * t[4] + m[2] * t[5] + m[4], m[1] * t[4] + m[3] * t[5] + m[5]];
  ops.fnArray.forEach((fn, i) => {
    const args = ops.argsArray[i];
    if (fn === OPS.save) stack.push({ ctm, fill });
    else if (fn === OPS.restore) ({ ctm, fill } = stack.pop() ?? { ctm: [1, 0, 0, 1, 0, 0], fill: '#000000' });
    else if (fn === OPS.setFillRGBColor) fill = String(args[0]);
    else if (fn === OPS.transform) ctm = mul(ctm, args);
    else if (fn === OPS.constructPath) {
      const [paint, , minMax] = args;
      if (!minMax) return;
      const [ax, ay, bx, by] = minMax;
      const p1 = [ctm[0] * ax + ctm[2] * ay + ctm[4], ctm[1] * ax + ctm[3] * ay + ctm[5]];
      const p2 = [ctm[0] * bx + ctm[2] * by + ctm[4], ctm[1] * bx + ctm[3] * by + ctm[5]];
      paths.push({ paint: names[paint] ?? paint, fill, x: Math.min(p1[0], p2[0]), y: Math.min(p1[1], p2[1]), width: Math.abs(p2[0] - p1[0]), height: Math.abs(p2[1] - p1[1]) });
    }
  });
  pages.push({
    width: x1 - x0,
    height: y1 - y0,
    text: text.items.filter((t) => 'str' in t).map((t) => ({ str: t.str, x: t.transform[4], y: t.transform[5] })),
    paths,
  });
}
process.stdout.write(JSON.stringify({ pages }));
