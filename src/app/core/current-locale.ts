import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, effect, inject, signal, untracked } from '@angular/core';

import { REPORT_API_ERRORS } from './api-error';
import { Auth } from './auth';

/** The studio's locale before the server has said: British English, as the setting starts. */
export const FIRST_LOCALE = 'en-GB';

/**
 * The signed-in studio's locale ("en-GB"): it orders the dates typed in the
 * forms now, and will say how numbers are written. Read from the server
 * whenever someone signs in (`loadLocaleOnSignIn`, at the app's start); the
 * settings page tells it when the owner picks another. Kept as the server's
 * text here, so the first load carries no list of locales: the date fields,
 * loaded later, check it against theirs.
 */
@Injectable({ providedIn: 'root' })
export class CurrentLocale {
  private readonly http = inject(HttpClient);
  private readonly current = signal(FIRST_LOCALE);

  readonly locale = this.current.asReadonly();

  /** Asks the server; a failed read keeps the locale it has (the fields still work, in that order). */
  load(): void {
    this.http
      .get<unknown>('/api/settings/locale', { context: new HttpContext().set(REPORT_API_ERRORS, false) })
      .subscribe({
        next: (body) => {
          const locale = (body as { locale?: unknown } | null)?.locale;
          if (typeof locale === 'string') this.current.set(locale);
        },
        error: () => undefined,
      });
  }

  /** After the owner saved another locale. */
  use(locale: string): void {
    this.current.set(locale);
  }
}

/**
 * For the app's start (in an injection context): reads the studio's locale
 * each time someone signs in, the session found at start among them.
 */
export function loadLocaleOnSignIn(): void {
  const auth = inject(Auth);
  const current = inject(CurrentLocale);
  effect(() => {
    if (auth.user()) untracked(() => current.load());
  });
}
