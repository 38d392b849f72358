import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { PRINTOUTS, printoutPdfs } from '../shared/src/index';
import { launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { SCREENSHOT_DIR } from './support/e2e-env';
import { renderPdfPage } from './support/render-pdf';

/** Drags with the mouse in small steps, as the CDK needs to see a drag start. */
async function drag(page: Page, from: string, to: string): Promise<void> {
  // Both ends on screen at once: a drag cannot start from, or end on, a spot scrolled out of view.
  const size = page.viewportSize();
  if (size && size.height < 1600) await page.setViewportSize({ width: size.width, height: 1600 });
  await page.locator(from).first().scrollIntoViewIfNeeded();
  await page.locator(to).first().scrollIntoViewIfNeeded();
  const a = (await page.locator(from).first().boundingBox())!;
  const b = (await page.locator(to).first().boundingBox())!;
  await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
  await page.mouse.down();
  for (let i = 1; i <= 12; i++) {
    await page.mouse.move(a.x + a.width / 2 + ((b.x + b.width / 2 - a.x - a.width / 2) * i) / 12, a.y + a.height / 2 + ((b.y + b.height / 2 - a.y - a.height / 2) * i) / 12);
  }
  await page.mouse.up();
}

describe('design, cut plan and printouts, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('lets the owner build a design, assign garments, see yield and shortfall, print the cut list and get the PDFs', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    const list = await (await page.request.get('/api/commissions?q=Work-shirt')).json();
    await page.goto(`/commissions/${list.items[0].id}`);
    await page.getByTestId('open-design').click();
    await page.waitForURL(/\/designs\/\d+$/);
    const commissionId = Number(new URL(page.url()).pathname.split('/').pop());

    // The demo's saved design: drawing, size in both units, the client's earlier answer.
    const drawing = page.getByTestId('quilt-drawing');
    await drawing.waitFor();
    await page.getByTestId('design-version').filter({ hasText: 'Version 2' }).waitFor();
    await page.getByTestId('finished-size').filter({ hasText: '72 in (182.9 cm) × 86 in (218.4 cm)' }).waitFor();
    await page.getByTestId('finished-size').filter({ hasText: 'length -2 in' }).waitFor();
    await page.getByTestId('client-answer').filter({ hasText: 'tucks under the pillows' }).waitFor();
    expect(await drawing.locator('polygon[data-position="0"]').count()).toBe(22); // hand-worked: background + 20 blades + centre
    await page.getByTestId('yield-row').first().waitFor();
    // The demo's green flannel has a breast pocket kept whole: the drawing marks the block that holds it, and says so.
    await drawing.locator('[data-testid="kept-mark"]').first().waitFor();
    expect(await drawing.locator('[data-testid="kept-mark"]').first().getAttribute('aria-label')).toMatch(/^Block \d+ keeps the breast pocket from the Green checked flannel shirt$/);
    await page.getByTestId('kept-legend').filter({ hasText: 'keeps the breast pocket' }).waitFor();
    await screenshot(page, 'design-page');

    // Build: twelve rows of blocks, far more than the garments hold (even with garments other specs add);
    // the drawing follows at once, the plan after the server re-plans.
    const rows = page.getByLabel('Rows');
    await rows.fill('12');
    await page.getByTestId('position-tile').nth(47).waitFor();
    expect(await page.getByTestId('position-tile').count()).toBe(48);
    await page.getByTestId('finished-size').filter({ hasText: '184 in' }).waitFor(); // hand-worked: 12 x 12 + 11 x 2 + 2 x 9
    // Assign a garment to the first block by dragging it from the fabrics.
    const blue = '[data-testid="fabric-chip"]:has-text("Blue oxford work shirt")';
    await drag(page, blue, '[data-testid="position-tile"][data-position="0"]');
    await page.waitForFunction(() => document.querySelector('svg[data-testid="quilt-drawing"] polygon[data-position="0"][data-fill^="garment:"]') !== null);
    // More blocks than the four shirts can give: the plan reports what is short and what to do.
    await page.getByTestId('shortfall').first().waitFor({ timeout: 20_000 });
    await page.getByText(/Use fewer blocks|smaller block|studio fabric/).first().waitFor();
    await screenshot(page, 'design-shortfall');

    // Back to five rows, and save as a new version.
    await rows.fill('5');
    await page.getByTestId('position-tile').nth(19).waitFor();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="position-tile"]').length === 20);
    await page.getByLabel('Note for this version').fill('First plate from the blue shirt');
    await page.getByRole('button', { name: 'Save as new version' }).click();
    await page.getByTestId('design-version').filter({ hasText: 'Version 3' }).waitFor();

    // The cut list's print view, as it prints.
    await page.getByRole('link', { name: 'Cut list to print' }).click();
    await page.waitForURL(/\/cut-list$/);
    await page.getByTestId('cut-list-meta').filter({ hasText: 'design version 3' }).waitFor();
    await page.getByTestId('cut-source').filter({ hasText: 'From the Blue oxford work shirt' }).waitFor();
    await page.getByTestId('cut-source').filter({ hasText: 'From the Green checked flannel shirt' }).getByTestId('kept-note').filter({ hasText: 'keeps the breast pocket from the Green checked flannel shirt, centred' }).waitFor();
    expect(await page.getByTestId('kept-piece').count()).toBe(1);
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, 'cut-list-print');
    await page.emulateMedia({ media: 'screen' });

    // Every printout's PDFs, downloaded with the owner's session.
    for (const { url } of PRINTOUTS.flatMap((p) => printoutPdfs(p, commissionId))) {
      const res = await page.request.get(url);
      expect(res.status()).toBe(200);
      expect(res.headers()['content-type']).toBe('application/pdf');
      const body = await res.body();
      expect(body.subarray(0, 5).toString()).toBe('%PDF-');
      if (url.includes('cut-list')) await renderPdfPage(browser, body, path.join(SCREENSHOT_DIR, 'cut-list-pdf-page1.png'));
      if (url.includes('paper=a4')) await renderPdfPage(browser, body, path.join(SCREENSHOT_DIR, 'templates-a4-page1.png'));
    }
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it('lets the owner make a group of garments and give it to blocks, then open the sewing order and templates to print', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    const list = await (await page.request.get('/api/commissions?q=Work-shirt')).json();
    const commissionId = Number(list.items[0].id);
    await page.goto(`/designs/${commissionId}`);
    const version = page.getByTestId('design-version');
    await version.waitFor();
    const before = Number(/Version (\d+)/.exec(await version.innerText())![1]);

    // "The blues": two of the shirts, ticked by name.
    await page.getByRole('button', { name: 'New group' }).click();
    await page.getByLabel('Group name').fill('The blues');
    await page.getByRole('checkbox', { name: 'Blue oxford work shirt' }).check();
    await page.getByRole('checkbox', { name: 'Navy knit polo' }).check();
    await page.getByRole('button', { name: 'Add group' }).click();
    await page.getByTestId('group-row').filter({ hasText: 'The blues' }).filter({ hasText: 'not given to anything yet' }).waitFor();
    // A second group, given to nothing: it is kept with the design all the same.
    await page.getByRole('button', { name: 'New group' }).click();
    await page.getByLabel('Group name').fill('Checks and stripes');
    await page.getByRole('checkbox', { name: 'Green checked flannel shirt' }).check();
    await page.getByRole('checkbox', { name: 'Red and grey striped shirt' }).check();
    await page.getByRole('button', { name: 'Add group' }).click();
    await page.getByTestId('group-row').filter({ hasText: 'Checks and stripes' }).waitFor();

    // Given to block 2 by dragging the group's chip, and to block 3 from the block's menu with the keyboard alone.
    await drag(page, '[data-testid="fabric-chip"]:has-text("The blues")', '[data-testid="position-tile"][data-position="1"]');
    await page.waitForFunction(() => document.querySelector('svg[data-testid="quilt-drawing"] polygon[data-position="1"][data-fill^="group:"]') !== null);
    await page.locator('[data-testid="position-tile"][data-position="2"]').focus();
    await page.keyboard.press('Enter');
    await page.getByRole('menuitem', { name: 'The blues' }).press('Enter');
    await page.locator('[data-testid="position-tile"][data-position="2"][data-fabric^="group:"]').waitFor();
    await page.getByTestId('group-row').filter({ hasText: 'given to 2 places' }).waitFor();
    // The drawing paints the group's blocks in stripes of its two garments' colours.
    const groupKey = (await page.locator('[data-testid="position-tile"][data-position="1"]').getAttribute('data-fabric'))!;
    const fill = await page.locator(`svg[data-testid="quilt-drawing"] polygon[data-fill="${groupKey}"]`).first().getAttribute('fill');
    expect(fill).toMatch(/^url\(#ks-group-/);
    expect(await page.locator(`svg[data-testid="quilt-drawing"] pattern[data-group="${groupKey}"] rect`).count()).toBe(2);
    await screenshot(page, 'design-group');

    // Saved with the design, and there again when the page is opened afresh.
    await page.getByLabel('Note for this version').fill('The blues in blocks 2 and 3');
    await page.getByRole('button', { name: 'Save as new version' }).click();
    await version.filter({ hasText: `Version ${before + 1}` }).waitFor();
    await page.reload();
    await page.getByTestId('group-row').filter({ hasText: 'The blues' }).filter({ hasText: 'Blue oxford work shirt, Navy knit polo' }).waitFor();
    await page.getByTestId('group-row').filter({ hasText: 'Checks and stripes' }).filter({ hasText: 'not given to anything yet' }).waitFor();
    expect(await page.locator('svg[data-testid="quilt-drawing"] polygon[data-position="2"][data-fill^="group:"]').count()).toBeGreaterThan(0);

    // The sewing order and the full-size templates, as they print.
    await page.getByRole('link', { name: 'Sewing order to print' }).click();
    await page.waitForURL(/\/designs\/\d+\/sewing-order$/);
    await page.getByRole('heading', { level: 1, name: 'Sewing order' }).waitFor();
    await page.getByTestId('sewing-order-meta').filter({ hasText: `design version ${before + 1}` }).waitFor();
    await page.getByTestId('sewing-section').first().waitFor();
    await page.goto(`/designs/${commissionId}/templates`);
    await page.getByRole('heading', { level: 1, name: 'Full-size templates' }).waitFor();
    const inch = page.getByTestId('check-inch');
    await inch.waitFor();
    // 1 in is 96 CSS pixels.
    const box = (await inch.boundingBox())!;
    expect(Math.abs(box.width - 96)).toBeLessThan(0.5);
    expect(Math.abs(box.height - 96)).toBeLessThan(0.5);
    await page.getByTestId('template').first().waitFor();
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, 'templates-print');
    await page.emulateMedia({ media: 'screen' });
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it('shows the client the shared drawing and takes their answer', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.clientA.email, DEMO_ACCOUNTS.clientA.password);
    await page.getByText('Work-shirt memory quilt').first().click();
    await page.getByTestId('see-design').click();
    await page.getByTestId('quilt-drawing').waitFor();
    await page.getByTestId('review-size').waitFor();
    const body = await page.locator('body').innerText();
    expect(body).not.toMatch(/yield|Cut list|£/);
    await page.getByLabel('A note for the maker').fill('Lovely. Could the green shirt be in the middle?');
    await page.getByRole('button', { name: 'Ask for a change' }).click();
    await page.getByTestId('review-answer').filter({ hasText: 'green shirt be in the middle' }).waitFor();
    await screenshot(page, 'client-design-review');
    expect(problems).toEqual([]);
    await page.context().close();
  });
});
