import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Stage } from '@keepstitch/shared';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import {
  Commission,
  CommissionChanges,
  CommissionDetail,
  CommissionDraft,
  CommissionPage,
  CommissionQuery,
  CustodyEventDraft,
  GarmentDetail,
  GarmentDraft,
  Panel,
  PanelDraft,
  StageReply,
  commissionDetailSchema,
  commissionPageSchema,
  commissionSchema,
  eventReplySchema,
  garmentDetailSchema,
  garmentSchema,
  panelSchema,
  stageReplySchema,
} from './commission';
import { withoutNulls } from '../ui/without-nulls';

/** Errors of these calls are shown by the page beside the form that sent them. */
const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** Every call the app makes about commissions, their garments, panels, stages and hours. */
@Injectable({ providedIn: 'root' })
export class CommissionsApi {
  private readonly http = inject(HttpClient);

  list(query: Partial<CommissionQuery> = {}): Observable<CommissionPage> {
    let params = new HttpParams();
    if (query.page !== undefined) params = params.set('page', query.page);
    if (query.pageSize !== undefined) params = params.set('pageSize', query.pageSize);
    if (query.sort) params = params.set('sort', query.sort);
    if (query.dir) params = params.set('dir', query.dir);
    if (query.stages?.length) params = params.set('stage', query.stages.join(','));
    if (query.q) params = params.set('q', query.q);
    if (query.dueWithinDays !== null && query.dueWithinDays !== undefined) {
      params = params.set('dueWithinDays', query.dueWithinDays);
    }
    if (query.clientId) params = params.set('clientId', query.clientId);
    return this.http
      .get<unknown>('/api/commissions', { params })
      .pipe(map((body) => commissionPageSchema.parse(body)));
  }

  get(id: number): Observable<CommissionDetail> {
    return this.http
      .get<unknown>(`/api/commissions/${id}`)
      .pipe(map((body) => commissionDetailSchema.parse(body)));
  }

  create(draft: CommissionDraft): Observable<Commission> {
    return this.http
      .post<unknown>('/api/commissions', withoutNulls(draft), quiet)
      .pipe(map((body) => commissionSchema.parse(body)));
  }

  /** Only the fields given are changed; a width or length goes as typed with its `unit`. */
  update(id: number, changes: CommissionChanges): Observable<Commission> {
    return this.http
      .patch<unknown>(`/api/commissions/${id}`, changes, quiet)
      .pipe(map((body) => commissionSchema.parse(body)));
  }

  /** The server's reason for a refused move reaches the caller, which shows it. */
  moveStage(id: number, to: Stage, note?: string): Observable<StageReply> {
    const body = note ? { to, note } : { to };
    return this.http
      .post<unknown>(`/api/commissions/${id}/stage`, body, quiet)
      .pipe(map((reply) => stageReplySchema.parse(reply)));
  }

  logHours(id: number, entry: { stage: Stage; hours: number; workedOn: string; note?: string }): Observable<void> {
    return this.http.post<unknown>(`/api/commissions/${id}/hours`, entry, quiet).pipe(map(() => undefined));
  }

  addGarment(commissionId: number, draft: GarmentDraft): Observable<GarmentDetail> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/garments`, withoutNulls(draft), quiet)
      .pipe(map((body) => garmentSchema.parse(body)));
  }

  garment(id: number): Observable<GarmentDetail> {
    return this.http.get<unknown>(`/api/garments/${id}`).pipe(map((body) => garmentDetailSchema.parse(body)));
  }

  /** Only the fields given are changed. */
  updateGarment(id: number, changes: Partial<GarmentDraft>): Observable<GarmentDetail> {
    return this.http
      .patch<unknown>(`/api/garments/${id}`, changes, quiet)
      .pipe(map((body) => garmentSchema.parse(body)));
  }

  recordEvent(garmentId: number, event: CustodyEventDraft) {
    return this.http
      .post<unknown>(`/api/garments/${garmentId}/events`, withoutNulls(event), quiet)
      .pipe(map((body) => eventReplySchema.parse(body)));
  }

  addPanel(garmentId: number, draft: PanelDraft): Observable<Panel> {
    return this.http
      .post<unknown>(`/api/garments/${garmentId}/panels`, draft, quiet)
      .pipe(map((body) => panelSchema.parse(body)));
  }

  updatePanel(id: number, changes: Partial<PanelDraft>): Observable<Panel> {
    return this.http
      .patch<unknown>(`/api/panels/${id}`, changes, quiet)
      .pipe(map((body) => panelSchema.parse(body)));
  }

  deletePanel(id: number): Observable<void> {
    return this.http.delete<void>(`/api/panels/${id}`).pipe(map(() => undefined));
  }
}
