import { mkdirSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { ROOT } from './support/e2e-env';
import { launchBrowser, openPage, screenshot, signIn, waitForCount } from './support/browser';

/** A noisy photo-sized JPEG (a couple of hundred kB), so an upload takes long enough to watch. */
async function photoFile(): Promise<string> {
  const dir = path.join(ROOT, 'test-output', 'e2e-files');
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, 'tartan-scarf.jpg');
  const width = 900;
  const height = 700;
  const pixels = Buffer.alloc(width * height * 3);
  for (let i = 0; i < pixels.length; i++) pixels[i] = (i * 2654435761) % 251;
  await sharp(pixels, { raw: { width, height, channels: 3 } }).jpeg({ quality: 92 }).toFile(file);
  return file;
}

/** Closes any notice at the foot of the page, so it cannot lie over the buttons below it. */
async function dismissNotices(page: Page): Promise<void> {
  const close = page.locator('mat-snack-bar-container').getByRole('button', { name: 'Close' });
  if (await close.count()) await close.first().click();
  await page.locator('mat-snack-bar-container').waitFor({ state: 'detached' });
}

async function choose(page: Page, label: string, option: string): Promise<void> {
  await page.getByLabel(label, { exact: true }).click();
  await page.getByRole('option', { name: option, exact: true }).click();
}

describe('commissions and garment intake, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('lets a client add a garment with a photo and watch it upload', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.clientA.email, DEMO_ACCOUNTS.clientA.password);
    await page.waitForURL(/\/portal$/);
    await page.getByRole('link', { name: 'Work-shirt memory quilt' }).click();
    // The quote and its payments load after the page and push the garments down: let them arrive first,
    // or the click can land where the button was a moment before.
    await page.getByRole('heading', { name: 'Payments' }).waitFor();
    await page.getByRole('button', { name: 'Add a garment' }).click();
    await page.getByLabel('What it is').fill('Tartan wool scarf');
    await page.getByLabel('Whose it was').fill('Edmund');
    await page.getByLabel('Its story').fill('He wore it to every match.');
    await page.locator('input[type=file]').setInputFiles(await photoFile());
    // Slow the upload down so its progress can be seen.
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 80 * 1024 });
    await page.getByRole('button', { name: 'Save garment' }).click();
    await page.locator('[data-testid="upload-file"][data-state="uploading"] mat-progress-bar').waitFor();
    await screenshot(page, 'portal-upload-progress');
    await page.locator('[data-testid="upload-file"][data-state="done"]').waitFor({ timeout: 30_000 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await page.getByRole('button', { name: 'Done' }).click();
    await page.getByTestId('garment-row').filter({ hasText: 'Tartan wool scarf' }).waitFor();
    await screenshot(page, 'portal-commission');
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it('lets the owner receive and store it, measure two panels in fractions, and move a commission on the board', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await page.waitForURL(/\/overview$/);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Commissions' }).click();
    await page.waitForURL(/\/commissions$/);
    await page.getByRole('link', { name: 'Work-shirt memory quilt' }).first().click();
    await page.getByTestId('garment-row').filter({ hasText: 'Tartan wool scarf' }).getByRole('link').click();
    await page.getByTestId('garment-status').filter({ hasText: 'Expected' }).waitFor();

    await choose(page, 'Event', 'Received');
    await page.getByRole('button', { name: 'Record event' }).click();
    await page.getByTestId('garment-status').filter({ hasText: 'In the studio' }).waitFor();
    // The page reloads the garment after each event: let it settle before filling the form again.
    await waitForCount(page.getByTestId('custody-event'), 2);
    await dismissNotices(page);
    await choose(page, 'Event', 'Stored');
    await page.getByLabel('Place', { exact: true }).fill('Box A5');
    expect(await page.getByLabel('Place', { exact: true }).inputValue()).toBe('Box A5');
    await page.getByRole('button', { name: 'Record event' }).click();
    await page.getByTestId('garment-place').filter({ hasText: 'Box A5' }).waitFor();
    await waitForCount(page.getByTestId('custody-event'), 3);
    await dismissNotices(page);

    for (const [index, [name, width, height]] of ([['back', '19 1/2', '26'], ['fringe end', '10 1/4', '22 1/2']] as const).entries()) {
      await page.getByRole('button', { name: 'Add panel' }).click();
      // The new row must be there before typing, or the typing lands in the row before it.
      await waitForCount(page.getByTestId('panel-row'), index + 1);
      const row = page.getByTestId('panel-row').nth(index);
      await row.getByLabel('Name').fill(name);
      await row.getByLabel('Width').fill(width);
      await row.getByLabel('Height').fill(height);
      await Promise.all([
        page.waitForResponse((r) => r.url().includes('/panels') && r.request().method() === 'POST' && r.status() === 201),
        row.getByRole('button', { name: 'Save panel' }).click(),
      ]);
      await dismissNotices(page);
    }
    await waitForCount(page.getByTestId('panel-row'), 2);
    // 19 1/2 in = 49.53 cm (1 in = 2.54 cm exactly): both systems are shown.
    const readings = await page.getByTestId('length-reading').allInnerTexts();
    expect(readings.join(' | ')).toMatch(/19 ?1\/2/);
    expect(readings.join(' | ')).toMatch(/49\.5/);
    await screenshot(page, 'garment-panels');

    // The board: a new enquiry (opened here through the API, as the new-commission form would) is dragged
    // to "Quoted", then moved on to "Booked" with its card's menu.
    const title = await page.evaluate(async () => {
      const token = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(document.cookie)![1]!);
      const clients = await (await fetch('/api/clients?q=Ines')).json();
      const res = await fetch('/api/commissions', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-XSRF-TOKEN': token },
        body: JSON.stringify({ clientId: clients.items[0].id, title: 'Spring baby play mat', kind: 'baby_quilt', ageGroup: 'baby_under_1' }),
      });
      return (await res.json()).title as string;
    });
    await page.goto('/commissions/board');
    const card = page.getByTestId('board-column-enquiry').getByTestId('board-card').filter({ hasText: title });
    await card.waitFor();
    const target = page.getByTestId('board-column-quoted');
    const from = (await card.boundingBox())!;
    const to = (await target.boundingBox())!;
    await page.mouse.move(from.x + from.width / 2, from.y + 20);
    await page.mouse.down();
    await page.mouse.move(from.x + from.width / 2 + 10, from.y + 30, { steps: 5 });
    await page.mouse.move(to.x + to.width / 2, to.y + 80, { steps: 20 });
    await page.mouse.up();
    await target.getByTestId('board-card').filter({ hasText: title }).waitFor();

    await target.getByTestId('board-card').filter({ hasText: title }).getByRole('button', { name: /Move to… another stage/ }).click();
    await page.getByRole('menuitem', { name: 'Booked' }).click();
    await page.getByTestId('board-column-booked').getByTestId('board-card').filter({ hasText: title }).waitFor();
    await screenshot(page, 'commission-board');
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it("takes dates typed in the studio's order in a browser of another locale and zone, and shows them in the long form", async () => {
    // An American browser far east of Greenwich: neither its locale nor its zone changes the studio's dates.
    const { page, problems } = await openPage(browser, { locale: 'en-US', timezoneId: 'Pacific/Kiritimati' });
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await page.goto('/commissions/new');
    await page.getByLabel('Client', { exact: true }).click();
    await page.getByRole('option').first().click();
    await page.getByLabel('Title', { exact: true }).fill('Autumn table runner');
    const deadline = page.getByLabel('Deadline', { exact: true });
    await deadline.fill('31/02/2027');
    await deadline.blur();
    await page.getByText('Type the date as DD/MM/YYYY, with a four-digit year, or pick it from the calendar').waitFor();
    expect(await deadline.inputValue()).toBe('31/02/2027');
    await deadline.fill('15/01/2027');
    const [created] = await Promise.all([
      page.waitForRequest((r) => new URL(r.url()).pathname === '/api/commissions' && r.method() === 'POST'),
      page.getByRole('button', { name: 'Open commission' }).click(),
    ]);
    expect(created.postDataJSON()).toEqual(expect.objectContaining({ title: 'Autumn table runner', deadline: '2027-01-15' }));
    await page.waitForURL(/\/commissions\/\d+$/);
    await page.getByText('15 Jan 2027').first().waitFor();
    await dismissNotices(page);

    await page.getByRole('spinbutton', { name: 'Hours', exact: true }).fill('1.5');
    const day = page.getByRole('textbox', { name: 'Date', exact: true });
    await day.fill('02/12/2026');
    const [logged] = await Promise.all([
      page.waitForRequest((r) => r.url().endsWith('/hours') && r.method() === 'POST'),
      page.getByRole('button', { name: 'Log hours' }).click(),
    ]);
    expect(logged.postDataJSON()).toEqual(expect.objectContaining({ hours: 1.5, workedOn: '2026-12-02' }));
    await page.getByTestId('hours-entry').filter({ hasText: '2 Dec 2026' }).waitFor();
    await screenshot(page, 'commission-dates');
    expect(problems).toEqual([]);
    await page.context().close();
  });
});
