import { DestroyRef, EnvironmentInjector, Injectable, inject } from '@angular/core';
import type { MatSnackBar, MatSnackBarConfig } from '@angular/material/snack-bar';

/**
 * Short messages at the foot of the screen: confirmations and problems.
 * The snack bar (and the overlay under it) is not part of the first load: it
 * is fetched once the first page is shown, or by the first message if that
 * comes sooner. Messages keep their order.
 */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly injector = inject(EnvironmentInjector);
  private snackBar?: Promise<typeof MatSnackBar>;
  /** Set when the app is torn down: a message still on its way is then dropped, not shown. */
  private closed = false;

  constructor() {
    inject(DestroyRef).onDestroy(() => (this.closed = true));
  }

  info(message: string): void {
    this.show(message, { duration: 4000, politeness: 'polite' });
  }

  error(message: string): void {
    this.show(message, { duration: 8000, politeness: 'assertive', panelClass: 'ks-error-snackbar' });
  }

  /** Fetches the snack bar ahead of any message, so one can still be shown after the connection drops. */
  preload(): void {
    void this.load().catch(() => undefined);
  }

  private show(message: string, config: MatSnackBarConfig): void {
    this.load().then(
      (snackBar) => {
        if (!this.closed) this.injector.get(snackBar).open(message, 'Close', config);
      },
      (error: unknown) => console.error('Could not show the message', JSON.stringify(message), error),
    );
  }

  private load(): Promise<typeof MatSnackBar> {
    this.snackBar ??= import('@angular/material/snack-bar').then(
      (m) => m.MatSnackBar,
      (error: unknown) => {
        this.snackBar = undefined; // try again with the next message
        throw error;
      },
    );
    return this.snackBar;
  }
}
