import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import { withoutNulls } from '../ui/without-nulls';
import { StockDraft, StockItem, stockItemSchema, stockListSchema } from './stock-item';

const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** The studio's own fabric stock. */
@Injectable({ providedIn: 'root' })
export class StockApi {
  private readonly http = inject(HttpClient);

  list(): Observable<StockItem[]> {
    return this.http.get<unknown>('/api/stock').pipe(map((body) => stockListSchema.parse(body).items));
  }

  create(draft: StockDraft): Observable<StockItem> {
    return this.http.post<unknown>('/api/stock', withoutNulls(draft), quiet).pipe(map((body) => stockItemSchema.parse(body)));
  }

  update(id: number, changes: Partial<StockDraft>): Observable<StockItem> {
    // Fibre and cost unit are choices, never blank; other empty fields are cleared with null.
    const { fibre, costUnit, ...rest } = changes;
    const body = { ...rest, ...(fibre ? { fibre } : {}), ...(costUnit ? { costUnit } : {}) };
    return this.http.patch<unknown>(`/api/stock/${id}`, body, quiet).pipe(map((body) => stockItemSchema.parse(body)));
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/stock/${id}`).pipe(map(() => undefined));
  }
}
