import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, firstValueFrom, from, map, of, switchMap, tap, throwError } from 'rxjs';

import { REPORT_API_ERRORS, apiErrorOf } from './api-error';
import { User, homeFor, readUser } from './user';

/** The `user` of an auth reply (`{ user: ... }`), not yet checked. */
function userOf(body: unknown): unknown {
  if (typeof body !== 'object' || body === null || !('user' in body)) {
    throw new TypeError('The server sent an auth reply without a user.');
  }
  return body.user;
}

/** Who is signed in. Loaded once at start; changed by signing in and out. */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly http = inject(HttpClient);
  private readonly currentUser = signal<User | null>(null);

  readonly user = this.currentUser.asReadonly();
  readonly role = computed(() => this.currentUser()?.role ?? null);
  readonly homeUrl = computed(() => {
    const role = this.role();
    return role ? homeFor(role) : '/sign-in';
  });

  /** Asks the server who this browser is signed in as (also refreshes the XSRF cookie). */
  load(): Promise<void> {
    const me$ = this.http.get<unknown>('/api/auth/me').pipe(
      map((body) => {
        const user = userOf(body);
        return user === null ? null : readUser(user);
      }),
      catchError(() => of(null)),
    );
    return firstValueFrom(me$).then((user) => this.currentUser.set(user));
  }

  /**
   * Errors are left to the sign-in form, which shows them beside the fields.
   * A refused security token (an old tab, an ended session) is fetched afresh
   * and the sign-in tried once more.
   */
  signIn(email: string, password: string): Observable<User> {
    const attempt = () =>
      this.http.post<unknown>(
        '/api/auth/sign-in',
        { email, password },
        { context: new HttpContext().set(REPORT_API_ERRORS, false) },
      );
    return attempt().pipe(
      catchError((error: unknown) =>
        apiErrorOf(error)?.code === 'csrf'
          ? from(this.load()).pipe(switchMap(() => attempt()))
          : throwError(() => error),
      ),
      map((body) => readUser(userOf(body))),
      tap((user) => this.currentUser.set(user)),
    );
  }

  /**
   * Ends the session, then asks the server again who this is: that also
   * brings the new security token the next sign-in needs.
   */
  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', null).pipe(
      catchError(() => of(null)),
      switchMap(() => from(this.load())),
      map(() => undefined),
    );
  }

  /** Forgets the user after the server said the session is gone. */
  forget(): void {
    this.currentUser.set(null);
  }
}
