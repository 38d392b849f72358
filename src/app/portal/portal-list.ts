import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { RouterLink } from '@angular/router';
import { COMMISSION_KIND, STAGE_LABELS } from '@keepstitch/shared';

import { Commission } from '../commissions/commission';
import { showDate } from '../ui/dates';
import { CommissionsApi } from '../commissions/commissions-api';
import { LoadStatus } from '../ui/load-status';

/** A client's own commissions. The server sends only theirs. */
@Component({
  selector: 'ks-portal-list',
  imports: [RouterLink, MatCardModule, MatButtonModule, LoadStatus],
  template: `
    <section aria-labelledby="portal-heading" class="portal-list">
      <h1 id="portal-heading">My commissions</h1>
      <ks-load-status what="your commissions" [loading]="loading()" [failed]="failed()" (retry)="load()" />
      @if (!failed() && !loading() && items().length === 0) {
        <div class="message" role="status">
          <p>You have no commissions yet. Once the studio opens one for you, it appears here.</p>
        </div>
      }
      <ul class="cards">
        @for (c of items(); track c.id) {
          <li>
            <mat-card appearance="outlined" data-testid="portal-commission">
              <mat-card-header>
                <mat-card-title><a [routerLink]="['/portal', c.id]">{{ c.title }}</a></mat-card-title>
                <mat-card-subtitle>{{ kindLabels[c.kind] }}</mat-card-subtitle>
              </mat-card-header>
              <mat-card-content>
                <p>Stage: <strong>{{ stageLabels[c.stage] }}</strong></p>
                @if (c.deadline) {
                  <p>Wanted by {{ showDate(c.deadline) }}</p>
                }
              </mat-card-content>
            </mat-card>
          </li>
        }
      </ul>
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-medium); margin: 0; }
    .cards { list-style: none; padding: 0; margin: 0; display: grid; gap: 1rem; grid-template-columns: repeat(auto-fill, minmax(18rem, 1fr)); }
    .message { padding: 1rem; border-radius: var(--mat-sys-corner-medium); background: var(--mat-sys-surface-container-low); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PortalList {
  private readonly api = inject(CommissionsApi);
  protected readonly stageLabels = STAGE_LABELS;
  protected readonly kindLabels = COMMISSION_KIND.labels;
  protected readonly showDate = showDate;
  protected readonly items = signal<Commission[]>([]);
  protected readonly loading = signal(true);
  protected readonly failed = signal(false);

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.failed.set(false);
    this.api.list({ page: 0, pageSize: 100, sort: 'deadline', dir: 'asc' }).subscribe({
      next: (page) => {
        this.items.set(page.items);
        this.loading.set(false);
      },
      error: () => {
        this.failed.set(true);
        this.loading.set(false);
      },
    });
  }
}
