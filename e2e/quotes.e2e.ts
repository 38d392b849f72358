import type { Browser, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { FAKE_MAIL_API, FAKE_PAYMENTS_URL } from './support/e2e-env';

const CUSHIONS = 'Two cushions from Nana\u2019s dresses';

interface CaughtMail {
  subject: string;
  to: string[];
  text: string;
  attachments: Array<{ filename: string; contentType: string }>;
}

/** Waits for the local mail server to receive a mail matching the test. */
async function mailArriving(match: (m: CaughtMail) => boolean, timeoutMs = 15_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const answer = await fetch(`${FAKE_MAIL_API}/messages`);
    const { items } = (await answer.json()) as { items: CaughtMail[] };
    const found = items.find(match);
    if (found) return found;
    if (Date.now() > until) throw new Error(`No such mail arrived; received: ${items.map((m) => m.subject).join(' | ')}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** The checkout page is the payment service's own (another port), and answers a declined card with 402. */
function appProblems(problems: string[]): string[] {
  return problems.filter((p) => !p.includes(FAKE_PAYMENTS_URL) && !/status of 402/.test(p));
}

async function payOnCheckoutPage(page: Page, card: string): Promise<void> {
  await page.getByLabel('Card number').fill(card);
  await page.getByRole('button', { name: /^Pay £/ }).click();
}

describe('quotes and payments, end to end', () => {
  let browser: Browser;
  let portalLink = '';

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('lets the owner make a new version of a sent quote, with live totals, and send it to the client by e-mail', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await page.waitForURL(/\/overview$/);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Commissions' }).click();
    await page.waitForURL(/\/commissions$/);
    await page.getByRole('link', { name: CUSHIONS }).click();
    await page.waitForURL(/\/commissions\/\d+$/);
    await page.getByRole('heading', { name: 'Quote', exact: true }).waitFor();
    await page.getByTestId('quote-version').filter({ hasText: 'v1' }).filter({ hasText: 'Sent' }).waitFor();
    await page.getByTestId('quote-detail').getByText('Waiting for the client’s answer').waitFor();

    await page.getByRole('button', { name: 'New quote', exact: true }).click();
    await page.getByRole('heading', { name: 'Version 2: Draft' }).waitFor();
    const before = await page.getByTestId('total-total').innerText();
    await page.getByRole('button', { name: 'Add discount' }).click();
    await page.getByLabel('Description of line 5').fill('Returning client');
    await page.getByLabel('Price each (£) of line 5').fill('5');
    await page.getByLabel('Price each (£) of line 5').press('Tab');
    await page.getByText('A discount is a negative amount, like -10.00').waitFor();
    await page.getByLabel('Price each (£) of line 5').fill('-5.00');
    await page.getByLabel('Price each (£) of line 5').press('Tab');
    await page.getByText('A discount is a negative amount, like -10.00').waitFor({ state: 'detached' });
    const after = await page.getByTestId('total-total').innerText();
    expect(Number(after.replace(/[£,]/g, ''))).toBeCloseTo(Number(before.replace(/[£,]/g, '')) - 5, 2);
    await screenshot(page, 'quote-editor');

    await page.getByRole('button', { name: 'Send quote' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('frozen').waitFor();
    await dialog.getByRole('button', { name: 'Send quote' }).click();
    await page.getByRole('heading', { name: 'Version 2: Sent' }).waitFor();
    await page.getByTestId('quote-version').filter({ hasText: 'v1' }).filter({ hasText: 'Replaced by a newer version' }).waitFor();
    await page.getByRole('link', { name: 'Download PDF' }).waitFor();
    await page.getByTestId('quote-detail').scrollIntoViewIfNeeded();
    await screenshot(page, 'quote-sent');

    // The client record's own address, not the sign-in's.
    const mail = await mailArriving((m) => m.text.includes(`Dear ${DEMO_ACCOUNTS.clientB.name}`) && /\(version 2\)/.test(m.text));
    expect(mail.attachments.map((a) => a.contentType)).toContain('application/pdf');
    const link = /https?:\/\/[^\s]+\/portal\/\d+\?quote=\d+/.exec(mail.text)?.[0];
    expect(link).toBeDefined();
    portalLink = new URL(link!).pathname + new URL(link!).search;

    await page.getByRole('link', { name: 'Mail', exact: true }).click();
    await page.waitForURL(/\/mail$/);
    await page.getByTestId('sent-mail').first().waitFor();
    await screenshot(page, 'mail-page');
    expect(appProblems(problems)).toEqual([]);
    await page.context().close();
  });

  it('lets the client open the link, accept, be told a declined card took nothing, then pay the deposit and see it booked', async () => {
    expect(portalLink).toMatch(/^\/portal\/\d+\?quote=\d+$/);
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.clientB.email, DEMO_ACCOUNTS.clientB.password);
    await page.goto(portalLink);
    await page.getByRole('heading', { name: 'Your quote' }).waitFor();
    await page.getByTestId('client-quote-facts').filter({ hasText: /Version 2\s+— valid until/ }).waitFor();
    await page.getByTestId('caution-small_parts').first().waitFor();
    await screenshot(page, 'portal-quote');

    await page.getByRole('button', { name: 'Accept quote' }).click();
    await page.getByText('Type your name to accept the quote').waitFor();
    await page.getByLabel('Your full name').fill(DEMO_ACCOUNTS.clientB.name);
    await page.getByRole('button', { name: 'Accept quote' }).click();
    await page.getByText(`accepted by ${DEMO_ACCOUNTS.clientB.name}`).waitFor();

    await page.getByRole('button', { name: /Pay deposit £/ }).click();
    await page.waitForURL((url) => url.href.startsWith(FAKE_PAYMENTS_URL));
    await payOnCheckoutPage(page, '4000 0000 0000 0002');
    await page.getByText('Your card was declined. No money was taken. Try another card.').waitFor();
    await screenshot(page, 'checkout-declined');

    await payOnCheckoutPage(page, '4242 4242 4242 4242');
    await page.waitForURL(/\/portal\/\d+\?payment=done/);
    await page.getByTestId('payment-status').getByText('Deposit paid').waitFor({ timeout: 20_000 });
    await page.getByTestId('client-due').filter({ hasText: /Deposit £[\d.,]+: paid\./ }).waitFor();
    await page.getByTestId('portal-stage').filter({ hasText: 'Booked' }).waitFor();
    await page.getByTestId('client-payment-row').filter({ hasText: 'Deposit' }).filter({ hasText: 'Paid' }).waitFor();
    await screenshot(page, 'portal-deposit-paid');
    expect(appProblems(problems)).toEqual([]);
    await page.context().close();
  });

  it('shows the owner the accepted version, who accepted it and the deposit paid; the workroom sees no quote', async () => {
    const { page, problems } = await openPage(browser);
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    const commissionPath = portalLink.replace('/portal/', '/commissions/').replace(/\?.*$/, '');
    await page.goto(commissionPath);
    await page.getByTestId('quote-facts').filter({ hasText: `Accepted by ${DEMO_ACCOUNTS.clientB.name}` }).waitFor();
    await page.getByTestId('payment-row').filter({ hasText: 'Deposit' }).filter({ hasText: 'Paid' }).waitFor();
    await page.getByTestId('current-stage').filter({ hasText: 'Booked' }).waitFor();
    await page.getByTestId('quote-detail').scrollIntoViewIfNeeded();
    await screenshot(page, 'quote-accepted-owner');

    await page.getByRole('link', { name: 'Settings', exact: true }).click();
    await page.waitForURL(/\/settings$/);
    await page.getByLabel('Studio name').and(page.locator('input')).waitFor();
    expect(await page.getByLabel('Studio name').and(page.locator('input')).inputValue()).toBe('Larkspur Bobbin Room');
    await screenshot(page, 'settings');
    await page.context().close();

    const workroom = await openPage(browser);
    const requests: string[] = [];
    workroom.page.on('request', (r) => requests.push(new URL(r.url()).pathname));
    await signIn(workroom.page, DEMO_ACCOUNTS.workroom.email, DEMO_ACCOUNTS.workroom.password);
    await workroom.page.goto(commissionPath);
    await workroom.page.getByRole('heading', { name: 'Garments' }).waitFor();
    expect(await workroom.page.getByRole('heading', { name: 'Quote', exact: true }).count()).toBe(0);
    // The studio's locale (the order dates are typed in) is every role's; the settings themselves are the owner's.
    expect(requests.filter((p) => /quotes|payments|settings/.test(p) && p !== '/api/settings/locale')).toEqual([]);
    expect(appProblems([...problems, ...workroom.problems])).toEqual([]);
    await workroom.page.context().close();
  });
});
