import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { ROOT } from './e2e-env';

const PDFJS = path.join(ROOT, 'node_modules', 'pdfjs-dist', 'legacy', 'build');
const HTML = `<!doctype html><html><body style="margin:0;background:#fff"><canvas id="c"></canvas>
<script type="module">
import * as pdfjs from '/pdf.mjs';
pdfjs.GlobalWorkerOptions.workerSrc = '/pdf.worker.mjs';
const doc = await pdfjs.getDocument({ url: '/doc.pdf', disableFontFace: false }).promise;
const page = await doc.getPage(Number(new URLSearchParams(location.search).get('page') || 1));
const viewport = page.getViewport({ scale: 2 });
const canvas = document.getElementById('c');
canvas.width = viewport.width; canvas.height = viewport.height;
canvas.style.width = viewport.width / 2 + 'px'; canvas.style.height = viewport.height / 2 + 'px';
await page.render({ canvasContext: canvas.getContext('2d'), viewport, canvas }).promise;
document.body.dataset.done = 'yes';
</script></body></html>`;

/**
 * Renders one page of a PDF to PNG with pdfjs-dist inside Chromium (its canvas),
 * since the machine has no PDF rasteriser. Nothing leaves the browser: every
 * request goes to a made-up host answered here.
 */
export async function renderPdfPage(browser: Browser, pdf: Buffer, out: string, pageNumber = 1): Promise<void> {
  const context = await browser.newContext({ viewport: { width: 900, height: 1200 }, deviceScaleFactor: 1 });
  const page = await context.newPage();
  await page.route('http://pdf.render/**', async (route) => {
    const url = new URL(route.request().url());
    if (url.pathname === '/') return route.fulfill({ contentType: 'text/html', body: HTML });
    if (url.pathname === '/doc.pdf') return route.fulfill({ contentType: 'application/pdf', body: pdf });
    if (url.pathname === '/pdf.mjs' || url.pathname === '/pdf.worker.mjs') {
      return route.fulfill({ contentType: 'text/javascript', body: readFileSync(path.join(PDFJS, url.pathname.slice(1))) });
    }
    return route.fulfill({ status: 404, body: '' });
  });
  await page.goto(`http://pdf.render/?page=${pageNumber}`);
  await page.waitForSelector('body[data-done="yes"]', { timeout: 30_000 });
  await page.locator('#c').screenshot({ path: out });
  await context.close();
}
