import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import { User, readUser } from '../core/user';

/** One-time links to choose a password: asking for one, and using one. */
@Injectable({ providedIn: 'root' })
export class PasswordLinksApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

  /** Asks for a link by e-mail; the answer is the same whether or not the address has a sign-in. */
  requestReset(email: string): Observable<string> {
    return this.http.post<{ message: string }>('/api/auth/forgot-password', { email }, this.quiet).pipe(map((body) => body.message));
  }

  /** Chooses the password with the link's token; the server signs this browser in and ends every other session. */
  setPassword(token: string, password: string): Observable<User> {
    return this.http.post<{ user: unknown }>('/api/auth/set-password', { token, password }, this.quiet).pipe(map((body) => readUser(body.user)));
  }
}
