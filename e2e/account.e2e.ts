import type { Browser } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';
import { launchBrowser, openPage, screenshot, signIn } from './support/browser';

describe('own password, end to end', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('lets a new assistant change the password the owner gave them, signing out their other browser', async () => {
    const email = 'wren.haddock@keepstitch.test';
    const first = 'given by the owner 1';
    const chosen = 'thimble lantern orchard';

    // The owner makes the sign-in.
    const owner = await openPage(browser);
    await signIn(owner.page, DEMO_ACCOUNTS.owner.email, DEMO_ACCOUNTS.owner.password);
    await owner.page.goto('/users/new');
    await owner.page.getByLabel('Name').fill('Wren Haddock');
    await owner.page.getByLabel('E-mail').fill(email);
    await owner.page.getByLabel('Password').fill(first);
    await owner.page.getByRole('button', { name: 'Create user' }).click();
    await owner.page.waitForURL(/\/users$/);
    await owner.page.getByRole('cell', { name: email }).waitFor();

    // Signed in on two browsers; the first changes the password.
    const elsewhere = await openPage(browser);
    await signIn(elsewhere.page, email, first);
    const here = await openPage(browser);
    await signIn(here.page, email, first);
    await here.page.getByRole('link', { name: 'Change password' }).click();
    await here.page.waitForURL(/\/password$/);
    await here.page.getByRole('heading', { name: 'Change password' }).waitFor();

    await here.page.getByLabel('Current password').fill('not the password');
    await here.page.getByLabel('New password', { exact: true }).fill(chosen);
    await here.page.getByLabel('New password again').fill(chosen);
    await here.page.getByRole('button', { name: 'Change password' }).click();
    await here.page.getByText('This is not your current password.').waitFor();
    await screenshot(here.page, 'change-password-refused');

    await here.page.getByLabel('Current password').fill(first);
    await here.page.getByRole('button', { name: 'Change password' }).click();
    await here.page.getByTestId('password-changed').waitFor();
    await screenshot(here.page, 'change-password-done');

    // This browser goes on; the other one is signed out.
    await here.page.getByRole('link', { name: 'Commissions' }).click();
    await here.page.waitForURL(/\/commissions/);
    await here.page.getByTestId('signed-in-user').waitFor();
    await elsewhere.page.reload();
    await elsewhere.page.waitForURL(/\/sign-in/);

    // Only the new password opens it now.
    await elsewhere.page.getByLabel('E-mail').fill(email);
    await elsewhere.page.getByLabel('Password').fill(first);
    await elsewhere.page.getByRole('button', { name: 'Sign in' }).click();
    await elsewhere.page.getByTestId('sign-in-error').waitFor();
    await signIn(elsewhere.page, email, chosen);
    await elsewhere.page.getByTestId('signed-in-user').waitFor();

    // The refused attempt is a 400 the page shows under its field; nothing else may go wrong.
    for (const p of [owner, elsewhere, here]) {
      expect(p.problems.filter((line) => !/status of 400/.test(line))).toEqual([]);
      await p.page.context().close();
    }
  });
});
