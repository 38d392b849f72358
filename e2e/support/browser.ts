import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Locator, type Page } from 'playwright-core';
import { BASE_URL, SCREENSHOT_DIR } from './e2e-env';

/** Debian's Chromium, headless, with nothing reaching outside the machine. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
}

/** A new page in a fresh context, failing the test on any console error or request to another host. */
export async function openPage(browser: Browser, options: { locale?: string; timezoneId?: string } = {}): Promise<{ page: Page; problems: string[] }> {
  const context = await browser.newContext({ baseURL: BASE_URL, viewport: { width: 1280, height: 800 }, ...options });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' && !/status of 40[134]/.test(m.text())) problems.push(`console: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('request', (r) => {
    if (!r.url().startsWith(BASE_URL) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) problems.push(`outside request: ${r.url()}`);
  });
  return { page, problems };
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** A picture of the page once its transitions have ended (a field's error fades in), so it shows what a person sees. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  // Endless animations (progress bars, spinners) never finish: only those with an end are awaited.
  await page.evaluate(() =>
    Promise.all(document.getAnimations().filter((a) => Number.isFinite(a.effect?.getComputedTiming().endTime ?? Infinity)).map((a) => a.finished.catch(() => undefined))),
  );
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

/** Waits until a locator matches exactly n elements (lists refresh after a debounce). */
export async function waitForCount(locator: Locator, n: number, timeoutMs = 10_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  let count = await locator.count();
  while (count !== n) {
    if (Date.now() > until) throw new Error(`Expected ${n} matching elements, found ${count}.`);
    await new Promise((r) => setTimeout(r, 100));
    count = await locator.count();
  }
}
