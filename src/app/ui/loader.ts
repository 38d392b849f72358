import { DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import type { Observable, Subscription } from 'rxjs';

import { apiErrorOf } from '../core/api-error';

/** Where a load stands; `missing` is the server's 404 (nothing there, or not the caller's to see). */
export type LoadState = 'loading' | 'ready' | 'missing' | 'failed';

export interface LoaderOptions<T> {
  /** Runs with each value as it arrives, before the state turns ready. */
  loaded?: (value: T) => void;
  /** Runs once each load has ended, either way. */
  ended?: (ok: boolean) => void;
  /** A 404 shows as `missing` (for a page with its own "not found" view); otherwise it is a failure like any other. */
  tellMissing?: boolean;
  /**
   * False: every load, a reload too, shows progress and leaves the state until
   * it ends (a page for paper, whose Print waits for what it will print).
   */
  reloadInPlace?: boolean;
}

/**
 * What a page or part loads by what it is given (its route id, an input):
 * create it in a field initialiser. It loads at once, and again whenever a
 * signal that `fetch` reads changes; a newer load cancels one still running,
 * so a stale answer never lands; and it stops with the component. `reload()`
 * keeps what is shown in place (no progress bar) and shows the bar only while
 * nothing has been shown yet or after a failure.
 */
export class Loader<T> {
  readonly value = signal<T | null>(null);
  readonly state = signal<LoadState>('loading');
  private running?: Subscription;

  constructor(
    private readonly fetch: () => Observable<T>,
    private readonly options: LoaderOptions<T> = {},
  ) {
    effect(() => {
      const request = this.fetch();
      untracked(() => this.start(request));
    });
    inject(DestroyRef).onDestroy(() => this.running?.unsubscribe());
  }

  reload(): void {
    this.start(untracked(() => this.fetch()));
  }

  private start(request: Observable<T>): void {
    this.running?.unsubscribe();
    if (this.state() !== 'ready' || this.options.reloadInPlace === false) this.state.set('loading');
    this.running = request.subscribe({
      next: (value) => {
        this.value.set(value);
        this.options.loaded?.(value);
        this.state.set('ready');
        this.options.ended?.(true);
      },
      error: (error: unknown) => {
        const missing = !!this.options.tellMissing && (apiErrorOf(error)?.code === 'not_found' || (error as { status?: number }).status === 404);
        this.state.set(missing ? 'missing' : 'failed');
        this.options.ended?.(false);
      },
    });
  }
}
