import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { PASSWORD_LENGTH } from '@keepstitch/shared';
import * as z from 'zod/mini';

import { User, roles } from '../core/user';

const userSchema: z.ZodMiniType<User> = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  clientId: z.nullable(z.number()),
});
const userListSchema = z.object({ items: z.array(userSchema) });

/** What the owner sends to open a sign-in for an assistant or a client. */
export interface NewUser {
  email: string;
  name: string;
  role: 'workroom' | 'client';
  clientId?: number;
  password: string;
}

export const minPasswordLength = PASSWORD_LENGTH.min;

/** The owner's calls about sign-ins. */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/users';

  list(): Observable<User[]> {
    return this.http.get<unknown>(this.base).pipe(map((body) => userListSchema.parse(body).items));
  }

  create(user: NewUser): Observable<User> {
    return this.http.post<unknown>(this.base, user).pipe(map((body) => userSchema.parse(body)));
  }

  setPassword(id: number, password: string): Observable<void> {
    return this.http
      .post<void>(`${this.base}/${id}/password`, { password })
      .pipe(map(() => undefined));
  }
}
