import { EnvironmentInjector, createEnvironmentInjector } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import { Notices } from './notices';

describe('Notices', () => {
  async function until(done: () => boolean): Promise<void> {
    for (let i = 0; i < 100 && !done(); i++) {
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
  }

  it('shows messages in the order given, once the snack bar has been fetched', async () => {
    const notices = TestBed.inject(Notices);
    const open = spyOn(TestBed.inject(MatSnackBar), 'open');
    notices.info('Client saved');
    notices.error('The server could not finish that just now.');
    expect(open).not.toHaveBeenCalled();

    await until(() => open.calls.count() === 2);
    expect(open.calls.allArgs()).toEqual([
      ['Client saved', 'Close', { duration: 4000, politeness: 'polite' }],
      [
        'The server could not finish that just now.',
        'Close',
        { duration: 8000, politeness: 'assertive', panelClass: 'ks-error-snackbar' },
      ],
    ]);
  });

  it('drops a message still on its way when the app is torn down, without an error', async () => {
    const open = spyOn(TestBed.inject(MatSnackBar), 'open');
    const failed = spyOn(console, 'error');
    const app = createEnvironmentInjector([Notices], TestBed.inject(EnvironmentInjector));
    app.get(Notices).info('Client saved');
    app.destroy();

    // A message sent by a live app is still shown, so the wait below is long enough to notice.
    TestBed.inject(Notices).info('Still here');
    await until(() => open.calls.count() === 1);
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(open.calls.allArgs().map(([message]) => message)).toEqual(['Still here']);
    expect(failed).not.toHaveBeenCalled();
  });
});
