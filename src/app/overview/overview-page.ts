import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { RouterLink } from '@angular/router';
import { STAGE_LABELS, formatPounds } from '@keepstitch/shared';

import { messageFor } from '../core/api-error';
import { LoadStatus } from '../ui/load-status';
import { showDate } from '../ui/dates';
import { Overview, OverviewApi } from './overview-api';

/** "in 3 days", "today", "2 days ago". */
export function daysText(days: number): string {
  if (days === 0) return 'today';
  if (days === 1) return 'tomorrow';
  if (days === -1) return 'yesterday';
  return days > 0 ? `in ${days} days` : `${-days} days ago`;
}

/** "for 1 day", "for 12 days", "since today". */
export function waitingText(days: number): string {
  return days <= 0 ? 'since today' : `for ${days} ${days === 1 ? 'day' : 'days'}`;
}

/**
 * The owner's first screen: deadlines this week and next with their stage,
 * quotes about to run out, balances still owed, garments still expected and
 * designs awaiting the client's answer, each linking to its commission.
 * The workroom sees the same page without the money.
 */
@Component({
  selector: 'ks-overview-page',
  imports: [RouterLink, MatListModule, MatIconModule, LoadStatus],
  templateUrl: './overview-page.html',
  styleUrl: './overview-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OverviewPage {
  private readonly api = inject(OverviewApi);

  protected readonly stageLabels = STAGE_LABELS;
  protected readonly pounds = formatPounds;
  protected readonly showDate = showDate;
  protected readonly daysText = daysText;
  protected readonly waitingText = waitingText;

  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');
  protected readonly reason = signal<string | null>(null);
  protected readonly overview = signal<Overview | null>(null);

  /** The deadlines in their weeks, each with its heading; a week with none is left out. */
  protected readonly deadlineGroups = computed(() => {
    const o = this.overview();
    if (!o) return [];
    const groups = [
      { week: 'overdue', name: 'Overdue' },
      { week: 'this', name: `This week, to ${showDate(o.thisWeekEnds)}` },
      { week: 'next', name: `Next week, to ${showDate(o.nextWeekEnds)}` },
    ] as const;
    return groups.map((g) => ({ ...g, items: o.deadlines.filter((d) => d.week === g.week) })).filter((g) => g.items.length);
  });

  constructor() {
    this.load();
  }

  protected load(): void {
    this.state.set('loading');
    this.api.get().subscribe({
      next: (overview) => {
        this.overview.set(overview);
        this.state.set('ready');
      },
      error: (error: unknown) => {
        this.reason.set(messageFor(error));
        this.state.set('failed');
      },
    });
  }
}
