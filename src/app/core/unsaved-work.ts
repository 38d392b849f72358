import { DOCUMENT, DestroyRef, EnvironmentInjector, Injectable, inject } from '@angular/core';
import { CanDeactivateFn, Router } from '@angular/router';

/**
 * What the open page has typed and not saved. Each form says how to tell
 * (`keepUnsavedWork`); leaving the page in the app then asks first
 * (`unsavedWorkGuard`), and so does closing or reloading the tab.
 */
@Injectable({ providedIn: 'root' })
export class UnsavedWork {
  private readonly injector = inject(EnvironmentInjector);
  private readonly checks = new Set<() => boolean>();
  private asking?: Promise<boolean>;

  /** Closing or reloading the tab: the browser asks in its own words (a page may not choose them). */
  readonly beforeUnload = (event: Event): void => {
    if (this.any()) event.preventDefault();
  };

  constructor() {
    inject(DOCUMENT).defaultView?.addEventListener('beforeunload', this.beforeUnload);
  }

  /** Counts `unsaved` until the component that called this (in its constructor) is destroyed. */
  watch(unsaved: () => boolean, destroyRef: DestroyRef): void {
    this.checks.add(unsaved);
    destroyRef.onDestroy(() => this.checks.delete(unsaved));
  }

  any(): boolean {
    return [...this.checks].some((unsaved) => unsaved());
  }

  /** True to leave. The dialog is fetched only when it is needed, and asked once however many navigations wait. */
  askToLeave(): Promise<boolean> {
    this.asking ??= Promise.all([import('@angular/material/dialog'), import('./confirm-dialog')])
      .then(([{ MatDialog }, { ConfirmDialog }]) =>
        new Promise<boolean>((resolve) => {
          this.injector
            .get(MatDialog)
            .open(ConfirmDialog, {
              data: {
                title: 'Leave without saving?',
                message: 'What you typed on this page has not been saved. If you leave now, it is lost.',
                confirmLabel: 'Leave without saving',
                cancelLabel: 'Stay on this page',
              },
              width: '28rem',
            })
            .afterClosed()
            .subscribe((leave: unknown) => resolve(leave === true));
        }),
      )
      // Without the dialog (the connection dropped) the browser's own question stands in.
      .catch(() => confirm('What you typed on this page has not been saved. Leave without saving?'))
      .finally(() => (this.asking = undefined));
    return this.asking;
  }
}

/** In a component's constructor: `unsaved` says whether it holds work that would be lost by leaving. */
export function keepUnsavedWork(unsaved: () => boolean): void {
  inject(UnsavedWork).watch(unsaved, inject(DestroyRef));
}

/** Navigation state for a leave the person already agreed to (signing out asks before it ends the session). */
export const LEAVING_UNSAVED = { leavingUnsaved: true } as const;

/** On a page's route: leaving with unsaved work asks first. */
export const unsavedWorkGuard: CanDeactivateFn<unknown> = () => {
  if (inject(Router).currentNavigation()?.extras.state?.['leavingUnsaved'] === true) return true;
  const work = inject(UnsavedWork);
  return work.any() ? work.askToLeave() : true;
};
