import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { launchBrowser, openPage, screenshot, signIn, waitForCount } from './support/browser';

describe('clients, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('lets the owner add a client, find it through the filter and edit it', async () => {
    const { page, problems } = await openPage(browser);
    await page.goto('/');
    await page.waitForURL(/\/sign-in/);
    await screenshot(page, 'sign-in');
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    // The owner lands on what is due.
    await page.waitForURL(/\/overview$/);
    await page.getByRole('heading', { name: 'What is due' }).waitFor();
    await page.getByRole('heading', { name: 'Garments still expected' }).waitFor();
    await screenshot(page, 'overview');
    await page.getByRole('link', { name: 'Clients' }).click();
    await page.waitForURL(/\/clients/);
    await page.getByRole('heading', { name: 'Clients' }).waitFor();
    await page.getByTestId('client-row').first().waitFor();
    await screenshot(page, 'clients-list');

    await page.getByRole('button', { name: 'Add client' }).first().click();
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Name is required').first().waitFor();
    await page.getByLabel('Name').fill('Odette Quillfeather');
    await page.getByLabel('E-mail').fill('odette@post.test');
    await page.getByLabel('Phone').fill('07700 900555');
    await screenshot(page, 'client-form');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.waitForURL(/\/clients$/);

    await page.getByLabel('Filter clients').fill('Quillfeather');
    const row = page.getByTestId('client-row').filter({ hasText: 'Odette Quillfeather' });
    await row.waitFor();
    await waitForCount(page.getByTestId('client-row'), 1);

    await row.click();
    await page.getByLabel('Notes').waitFor();
    await page.getByLabel('Phone').fill('07700 900556');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.waitForURL(/\/clients$/);
    await page.getByLabel('Filter clients').fill('900556');
    await page.getByTestId('client-row').filter({ hasText: 'Odette Quillfeather' }).waitFor();
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it('says when the list could not be loaded, and loads it on Try again', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await page.waitForURL(/\/overview$/);
    // The server is unwell for the first request of the list, then well again.
    const listUrl = /\/api\/clients\?/;
    await page.route(listUrl, (route) =>
      route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'The database is not answering just now.' } }) }),
    );
    await page.getByRole('link', { name: 'Clients' }).click();
    const alert = page.getByRole('alert').filter({ hasText: 'The clients could not be loaded.' });
    await alert.waitFor();
    await screenshot(page, 'clients-list-failed');
    expect(await page.getByTestId('client-row').count()).toBe(0);

    await page.unroute(listUrl);
    await alert.getByRole('button', { name: 'Try again' }).click();
    await page.getByTestId('client-row').first().waitFor();
    expect(await alert.count()).toBe(0);
    // The refused request is the only problem the browser reported.
    expect(problems.filter((p) => !/status of 503/.test(p))).toEqual([]);
    await page.context().close();
  });

  it('asks before leaving a form with typed work, and keeps it when the owner stays', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await page.waitForURL(/\/overview$/);
    await page.goto('/clients/new');
    await page.getByLabel('Name').fill('Perpetua Ashgrove');
    await page.getByRole('link', { name: 'Commissions' }).click();
    const dialog = page.getByRole('dialog', { name: 'Leave without saving?' });
    await dialog.waitFor();
    await screenshot(page, 'leave-without-saving');
    await dialog.getByRole('button', { name: 'Stay on this page' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect(page.url()).toMatch(/\/clients\/new$/);
    expect(await page.getByLabel('Name').inputValue()).toBe('Perpetua Ashgrove');

    await page.getByRole('link', { name: 'Commissions' }).click();
    await dialog.getByRole('button', { name: 'Leave without saving' }).click();
    await page.waitForURL(/\/commissions$/);

    // Signing out asks before the session ends, once, and staying keeps the owner signed in.
    await page.goto('/clients/new');
    await page.getByLabel('Name').fill('Perpetua Ashgrove');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await dialog.getByRole('button', { name: 'Stay on this page' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Save' }).click();
    await page.waitForURL(/\/clients$/);
    await page.getByLabel('Filter clients').fill('Ashgrove');
    await page.getByTestId('client-row').filter({ hasText: 'Perpetua Ashgrove' }).waitFor();

    await page.goto('/clients/new');
    await page.getByLabel('Name').fill('Someone not kept');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await dialog.getByRole('button', { name: 'Leave without saving' }).click();
    await page.waitForURL(/\/sign-in/);
    expect(await dialog.count()).toBe(0);
    expect(problems).toEqual([]);
    await page.context().close();
  });

  it('shows a signed-in client only their own record', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.clientA.email, DEMO_ACCOUNTS.clientA.password);
    await page.waitForURL(/\/portal/);
    await page.getByRole('link', { name: 'My details' }).click();
    await page.waitForURL(/\/my-details/);
    await page.getByText(DEMO_ACCOUNTS.clientA.name).first().waitFor();
    const body = await page.locator('body').innerText();
    expect(body).not.toContain(DEMO_ACCOUNTS.clientB.name);
    expect(body).not.toContain('Ines Valcourt-Reyne');
    await screenshot(page, 'client-my-details');
    // The owner's screens are not the client's.
    await page.goto('/clients');
    await page.waitForURL((url) => !url.pathname.startsWith('/clients'));
    expect(problems).toEqual([]);
    await page.context().close();
  });
});
