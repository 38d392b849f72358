import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { DesignBody, PrintoutSource, PrintoutSources } from '@keepstitch/shared';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import { CareCard, DesignPreview, DesignScreen, DesignVersion, SharedDesign, careCardSchema, designScreenSchema, previewSchema, sharedDesignSchema, versionSchema } from './design';

/** Errors of these calls are shown by the page beside what sent them. */
const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** Every call about a commission's design, its review by the client and its printouts. */
@Injectable({ providedIn: 'root' })
export class DesignsApi {
  private readonly http = inject(HttpClient);

  screen(commissionId: number): Observable<DesignScreen> {
    return this.http.get<unknown>(`/api/commissions/${commissionId}/design`).pipe(map((b) => designScreenSchema.parse(b)));
  }

  /** One saved version as it was stored, for reading. */
  version(commissionId: number, version: number): Observable<DesignVersion> {
    return this.http.get<unknown>(`/api/commissions/${commissionId}/design/versions/${version}`, quiet).pipe(map((b) => versionSchema.parse(b)));
  }

  careCard(commissionId: number): Observable<CareCard> {
    return this.http.get<unknown>(`/api/commissions/${commissionId}/care-card`).pipe(map((b) => careCardSchema.parse(b)));
  }

  preview(commissionId: number, body: DesignBody): Observable<DesignPreview> {
    return this.http.post<unknown>(`/api/commissions/${commissionId}/design/preview`, body, quiet).pipe(map((b) => previewSchema.parse(b)));
  }

  save(commissionId: number, body: DesignBody, note: string | null): Observable<DesignVersion> {
    return this.http.post<unknown>(`/api/commissions/${commissionId}/design`, { body, note }, quiet).pipe(map((b) => versionSchema.parse(b)));
  }

  share(commissionId: number): Observable<void> {
    return this.http.post<unknown>(`/api/commissions/${commissionId}/design/share`, {}, quiet).pipe(map(() => undefined));
  }

  shared(commissionId: number): Observable<SharedDesign> {
    return this.http.get<unknown>(`/api/commissions/${commissionId}/design/shared`).pipe(map((b) => sharedDesignSchema.parse(b)));
  }

  respond(commissionId: number, response: 'approved' | 'changes_requested', note: string | null): Observable<void> {
    return this.http.post<unknown>(`/api/commissions/${commissionId}/design/response`, { response, note }, quiet).pipe(map(() => undefined));
  }

  /** What a printout is drawn from: the design screen's latest version with its garments, or the care card. */
  printoutData<S extends PrintoutSource>(source: S, commissionId: number): Observable<PrintoutSources[S]> {
    const data: { [K in PrintoutSource]: () => Observable<PrintoutSources[K]> } = {
      design: () => this.screen(commissionId).pipe(map((s) => ({ commission: s.commission, version: s.current, garments: s.garments, stock: s.stock, fabrics: s.fabrics }))),
      'care-card': () => this.careCard(commissionId),
    };
    return data[source]();
  }
}
