import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import { CalendarFeed, StudioSettings, StudioSettingsPatch, calendarFeedSchema, studioSettingsSchema } from './studio-settings';

/** Errors of saving are shown by the page beside the form. */
const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** The studio's settings: one record, read and changed by the owner. */
@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly http = inject(HttpClient);

  get(): Observable<StudioSettings> {
    return this.http.get<unknown>('/api/settings').pipe(map((body) => studioSettingsSchema.parse(body)));
  }

  update(patch: StudioSettingsPatch): Observable<StudioSettings> {
    return this.http.patch<unknown>('/api/settings', patch, quiet).pipe(map((body) => studioSettingsSchema.parse(body)));
  }

  /** A new secret address for the calendar feed (shown once); the one before stops working. */
  makeCalendarFeed(): Observable<CalendarFeed> {
    return this.http.post<unknown>('/api/settings/calendar-feed', {}).pipe(map((body) => calendarFeedSchema.parse(body)));
  }

  stopCalendarFeed(): Observable<void> {
    return this.http.delete<void>('/api/settings/calendar-feed');
  }
}
