import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';

/** The signed-in person's own sign-in. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  /** Changes the password; the server ends every other session of this person. */
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http
      .post<unknown>('/api/auth/password', { currentPassword, newPassword }, { context: new HttpContext().set(REPORT_API_ERRORS, false) })
      .pipe(map(() => undefined));
  }
}
