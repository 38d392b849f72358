import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, firstValueFrom, map, of, tap } from 'rxjs';
import * as z from 'zod/mini';

import { REPORT_API_ERRORS } from './api-error';
import { User, homeFor, userSchema } from './user';

const meSchema = z.object({ user: z.nullable(userSchema) });
const signInSchema = z.object({ user: userSchema });

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
      map((body) => meSchema.parse(body).user),
      catchError(() => of(null)),
    );
    return firstValueFrom(me$).then((user) => this.currentUser.set(user));
  }

  /** Errors are left to the sign-in form, which shows them beside the fields. */
  signIn(email: string, password: string): Observable<User> {
    return this.http
      .post<unknown>(
        '/api/auth/sign-in',
        { email, password },
        { context: new HttpContext().set(REPORT_API_ERRORS, false) },
      )
      .pipe(
        map((body) => signInSchema.parse(body).user),
        map((user) => {
          this.currentUser.set(user);
          return user;
        }),
      );
  }

  signOut(): Observable<void> {
    // Forgotten before the caller hears back, so the sign-in page opens for nobody.
    const forget = () => this.currentUser.set(null);
    return this.http.post<void>('/api/auth/sign-out', null).pipe(
      map(() => undefined),
      tap({ complete: forget, error: forget }),
    );
  }

  /** Forgets the user after the server said the session is gone. */
  forget(): void {
    this.currentUser.set(null);
  }
}
