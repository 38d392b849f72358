import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { ALL_STAGES } from '@keepstitch/shared';
import { Observable, map } from 'rxjs';
import * as z from 'zod/mini';

const stage = z.enum(ALL_STAGES);

export const overviewSchema = z.object({
  today: z.string(),
  thisWeekEnds: z.string(),
  nextWeekEnds: z.string(),
  deadlines: z.array(
    z.object({
      commissionId: z.number(),
      title: z.string(),
      clientName: z.string(),
      stage,
      deadline: z.string(),
      daysLeft: z.number(),
      week: z.enum(['overdue', 'this', 'next']),
    }),
  ),
  garmentsExpected: z.array(z.object({ garmentId: z.number(), commissionId: z.number(), title: z.string(), description: z.string(), waitingDays: z.number() })),
  designsAwaiting: z.array(z.object({ commissionId: z.number(), title: z.string(), version: z.number(), sharedOn: z.string(), waitingDays: z.number() })),
  /** The owner's only: money. */
  quotesExpiring: z.optional(
    z.array(z.object({ quoteId: z.number(), commissionId: z.number(), title: z.string(), version: z.number(), validUntil: z.string(), daysLeft: z.number(), totalPence: z.nullable(z.number()) })),
  ),
  balancesDue: z.optional(z.array(z.object({ commissionId: z.number(), title: z.string(), stage, deadline: z.nullable(z.string()), balancePence: z.number() }))),
});
export type Overview = z.infer<typeof overviewSchema>;

/** What is due: the overview read in one request. */
@Injectable({ providedIn: 'root' })
export class OverviewApi {
  private readonly http = inject(HttpClient);

  get(): Observable<Overview> {
    return this.http.get<unknown>('/api/overview').pipe(map((body) => overviewSchema.parse(body)));
  }
}
