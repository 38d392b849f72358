import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import * as z from 'zod/mini';

import {
  Client,
  ClientDraft,
  ClientPage,
  ClientQuery,
  ClientRecord,
  clientPageSchema,
  clientRecordSchema,
  clientSchema,
} from './client';
import { REPORT_API_ERRORS } from '../core/api-error';

const ownPageSchema = z.object({ items: z.array(clientSchema) });

/** Every call the app makes about client records. Replies are checked before use. */
@Injectable({ providedIn: 'root' })
export class ClientsApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/clients';

  list(query: Partial<ClientQuery> = {}): Observable<ClientPage> {
    let params = new HttpParams();
    if (query.page !== undefined) params = params.set('page', query.page);
    if (query.pageSize !== undefined) params = params.set('pageSize', query.pageSize);
    if (query.sort) params = params.set('sort', query.sort);
    if (query.dir) params = params.set('dir', query.dir);
    if (query.q) params = params.set('q', query.q);
    return this.http
      .get<unknown>(this.base, { params })
      .pipe(map((body) => clientPageSchema.parse(body)));
  }

  /** A client's own record: for the client role the list holds only theirs. */
  own(): Observable<Client | null> {
    const params = new HttpParams().set('page', 0).set('pageSize', 1);
    return this.http
      .get<unknown>(this.base, { params })
      .pipe(map((body) => ownPageSchema.parse(body).items[0] ?? null));
  }

  get(id: number): Observable<Client> {
    return this.http.get<unknown>(`${this.base}/${id}`).pipe(map((body) => clientSchema.parse(body)));
  }

  /** The client's commissions, quotes and payments (the owner's). */
  record(id: number): Observable<ClientRecord> {
    return this.http.get<unknown>(`${this.base}/${id}/record`).pipe(map((body) => clientRecordSchema.parse(body)));
  }

  create(draft: ClientDraft): Observable<Client> {
    return this.http.post<unknown>(this.base, draft).pipe(map((body) => clientSchema.parse(body)));
  }

  update(id: number, changes: Partial<ClientDraft>): Observable<Client> {
    return this.http
      .patch<unknown>(`${this.base}/${id}`, changes)
      .pipe(map((body) => clientSchema.parse(body)));
  }

  /**
   * Invites the client to their page (again): a new one-time link goes to
   * their saved e-mail address and an earlier one stops working. Errors are
   * left to the form, which shows what to do.
   */
  invite(id: number): Observable<Client> {
    return this.http
      .post<unknown>(`${this.base}/${id}/invitation`, null, { context: new HttpContext().set(REPORT_API_ERRORS, false) })
      .pipe(map((body) => clientSchema.parse(body)));
  }

    remove(id: number): Observable<void> {
    return this.http.delete<void>(`${this.base}/${id}`).pipe(map(() => undefined));
  }
}
