import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { launchBrowser, openPage, screenshot, signIn } from './support/browser';
import { FAKE_MAIL_API } from './support/e2e-env';

interface CaughtMail {
  subject: string;
  to: string[];
  text: string;
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

const linkIn = (mail: CaughtMail) => /https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]+/.exec(mail.text)?.[0];

describe('inviting a client to their page, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('the owner invites a client, who chooses a password from the e-mailed link and lands on their page', async () => {
    const email = 'juniper.wick@example.test';
    const owner = await openPage(browser);
    await signIn(owner.page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await owner.page.goto('/clients/new');
    await owner.page.getByLabel('Name').fill('Juniper Wick');
    await owner.page.getByLabel('E-mail').fill(email);
    await owner.page.getByRole('button', { name: 'Save' }).click();
    await owner.page.waitForURL(/\/clients$/);
    const list = await (await owner.page.request.get('/api/clients?q=Juniper%20Wick')).json();
    const id = list.items[0].id as number;

    await owner.page.goto(`/clients/${id}`);
    await owner.page.getByTestId('invitation-state').getByText(/Not invited yet/).waitFor();
    await owner.page.getByRole('button', { name: 'Invite to their page' }).click();
    await owner.page.getByTestId('invitation-state').getByText(/Invitation sent on .*, not used yet/).waitFor();
    await screenshot(owner.page, 'client-invitation-sent');

    // Sent again: only the newest link works.
    await owner.page.getByRole('button', { name: 'Send the invitation again' }).click();
    const invitations = async () => {
      const { items } = (await (await fetch(`${FAKE_MAIL_API}/messages`)).json()) as { items: CaughtMail[] };
      return items.filter((m) => m.to.includes(email) && /choose a password/.test(m.subject));
    };
    await mailArriving((m) => m.to.includes(email));
    const until = Date.now() + 15_000;
    while ((await invitations()).length < 2 && Date.now() < until) await new Promise((r) => setTimeout(r, 250));
    const [first, second] = (await invitations()).map(linkIn);
    expect(first).toBeDefined();
    expect(second).toBeDefined();
    expect(second).not.toBe(first);
    // The mail server lists mails as they arrive, and the outbox sends them in order: the first link is the older.
    const client = await openPage(browser);
    const choosePassword = async (link: string) => {
      await client.page.goto(link.replace(/^https?:\/\/[^/]+/, ''));
      await client.page.getByRole('heading', { name: 'Choose your password' }).waitFor();
      await client.page.getByLabel('New password', { exact: true }).fill('bobbin meadow lantern');
      await client.page.getByLabel('New password again').fill('bobbin meadow lantern');
      await client.page.getByRole('button', { name: 'Save password and sign in' }).click();
    };
    await choosePassword(first!);
    await client.page.getByTestId('set-password-error').getByText(/expired or has already been used/).waitFor();
    await screenshot(client.page, 'set-password-old-link');
    await choosePassword(second!);
    await client.page.waitForURL(/\/portal/);
    await client.page.getByRole('heading', { name: 'My commissions' }).waitFor();
    await client.page.getByTestId('signed-in-user').waitFor();
    await screenshot(client.page, 'set-password-landed-on-portal');

    // The owner now sees the invitation as accepted, with nothing more to send.
    await owner.page.reload();
    await owner.page.getByTestId('invitation-state').getByText('Can sign in to their page.').waitFor();
    expect(await owner.page.getByRole('button', { name: /invitation|Invite/ }).count()).toBe(0);

    // The refused old link is a 400 the page shows; nothing else may go wrong.
    for (const p of [owner, client]) {
      expect(p.problems.filter((line) => !/status of 400/.test(line))).toEqual([]);
      await p.page.context().close();
    }
  });
});
