import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { PRINTOUTS } from '../shared/src/index';
import { launchBrowser, openPage, signIn } from './support/browser';

/**
 * Every page of each role, checked with axe-core against WCAG 2.1 levels A and AA
 * (names, labels, contrast, landmarks, roles) once it has loaded and settled.
 */
describe('accessibility, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  /** The WCAG A and AA problems axe finds on the page as it stands, one line each. */
  async function problemsOn(page: Page): Promise<string[]> {
    await page.waitForLoadState('networkidle');
    await page.locator('mat-progress-bar').first().waitFor({ state: 'detached' });
    await page.evaluate(() =>
      Promise.all(document.getAnimations().filter((a) => Number.isFinite(a.effect?.getComputedTiming().endTime ?? Infinity)).map((a) => a.finished.catch(() => undefined))),
    );
    const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
    return result.violations.map((v) => `${page.url()} ${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  }

  async function check(page: Page, paths: string[]): Promise<string[]> {
    const found: string[] = [];
    for (const path of paths) {
      await page.goto(path);
      found.push(...(await problemsOn(page)));
    }
    return found;
  }

  /** A fresh page signed in as one of the demo accounts. */
  async function signedIn(account: { email: string; password: string }): Promise<{ page: Page; problems: string[] }> {
    const opened = await openPage(browser);
    await signIn(opened.page, account.email, account.password);
    return opened;
  }

  async function workShirt(page: Page): Promise<{ commission: number; garment: number }> {
    const list = await (await page.request.get('/api/commissions?q=Work-shirt')).json();
    const commission = list.items[0].id as number;
    const detail = await (await page.request.get(`/api/commissions/${commission}`)).json();
    return { commission, garment: detail.garments[0].id as number };
  }

  it('finds nothing on the sign-in page, with and without its errors', async () => {
    const { page, problems } = await openPage(browser);
    const found = await check(page, ['/sign-in']);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(/required|Enter/i).first().waitFor();
    found.push(...(await problemsOn(page)));
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });

  it('finds nothing on the pages for a forgotten password and for choosing one from a link', async () => {
    const { page, problems } = await openPage(browser);
    const found = await check(page, ['/forgot-password', '/set-password?token=not-a-real-token']);
    await page.getByRole('button', { name: 'Save password and sign in' }).click();
    await page.getByText('Enter a new password').waitFor();
    found.push(...(await problemsOn(page)));
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });

  it('finds nothing on the owner’s commission pages', async () => {
    const { page, problems } = await signedIn(DEMO_ACCOUNTS.owner);
    const { commission, garment } = await workShirt(page);
    const found = await check(page, ['/commissions', '/commissions/board', `/commissions/${commission}`, `/commissions/${commission}/garments/${garment}`, `/commissions/${commission}/edit`]);
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });

  it('finds nothing on the owner’s design and printing pages', async () => {
    const { page, problems } = await signedIn(DEMO_ACCOUNTS.owner);
    const { commission } = await workShirt(page);
    const found = await check(page, [`/designs/${commission}`, ...PRINTOUTS.map((p) => `/designs/${commission}/${p.id}`)]);
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });

  it('finds nothing on the owner’s studio pages, nor on a form showing its errors', async () => {
    const { page, problems } = await signedIn(DEMO_ACCOUNTS.owner);
    const found = await check(page, ['/overview', '/clients', '/stock', '/settings', '/mail', '/users', '/password']);
    // A form showing its errors, with their colours and their ties to the fields.
    await page.goto('/clients/new');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Name is required').first().waitFor();
    found.push(...(await problemsOn(page)));
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });

  it('finds nothing on the pages a client sees', async () => {
    const { page, problems } = await signedIn(DEMO_ACCOUNTS.clientA);
    const list = await (await page.request.get('/api/commissions')).json();
    const commission = list.items[0].id as number;
    const found = await check(page, ['/portal', `/portal/${commission}`, `/designs/${commission}/review`, ...PRINTOUTS.filter((p) => p.roles.includes('client')).map((p) => `/designs/${commission}/${p.id}`), '/my-details']);
    expect(found).toEqual([]);
    expect(problems).toEqual([]);
  });
});
