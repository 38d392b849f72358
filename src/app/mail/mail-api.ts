import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import * as z from 'zod/mini';

import { REPORT_API_ERRORS } from '../core/api-error';

const text = z.optional(z.nullable(z.string()));

export const outboxMailSchema = z.object({
  id: z.number(),
  kind: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  status: z.string(),
  attempts: z.number(),
  lastError: text,
  nextAttemptAt: text,
  createdAt: z.string(),
  commissionId: z.optional(z.nullable(z.number())),
});
export type OutboxMail = z.infer<typeof outboxMailSchema>;

export const sentMailSchema = z.object({
  id: z.number(),
  from: z.optional(z.string()),
  to: z.union([z.array(z.string()), z.string()]),
  subject: z.string(),
  date: z.string(),
  text: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number(), url: z.string() })),
});
export type SentMail = z.infer<typeof sentMailSchema>;

/** The sent-mail list answers 404 where no local mail server keeps mails: the page says so itself. */
const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** The owner's view of the studio's e-mail: what is still to be delivered, and in development what was delivered. */
@Injectable({ providedIn: 'root' })
export class MailApi {
  private readonly http = inject(HttpClient);

  outbox(): Observable<OutboxMail[]> {
    return this.http
      .get<unknown>('/api/mail/outbox')
      .pipe(map((body) => z.object({ items: z.array(outboxMailSchema) }).parse(body).items));
  }

  retry(id: number): Observable<void> {
    return this.http.post<unknown>(`/api/mail/outbox/${id}/retry`, null, quiet).pipe(map(() => undefined));
  }

  sent(): Observable<SentMail[]> {
    return this.http
      .get<unknown>('/api/mail/sent', quiet)
      .pipe(map((body) => z.object({ items: z.array(sentMailSchema) }).parse(body).items));
  }
}
