import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { COMMISSION_KIND, FIBRE } from '@keepstitch/shared';

import { Auth } from '../core/auth';
import { CareCard } from './design';
import { DesignsApi } from './designs-api';

/** The care card for the finished piece as a page for paper; the client reaches it from the portal. */
@Component({
  selector: 'ks-care-card-print',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './care-card-print.html',
  styleUrl: './care-card-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CareCardPrint {
  private readonly api = inject(DesignsApi);
  private readonly auth = inject(Auth);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly card = signal<CareCard | null>(null);
  protected readonly failed = signal(false);
  /** Clients came from their portal; the studio from the design. */
  protected readonly back = computed(() =>
    this.auth.role() === 'client'
      ? { link: ['/portal', this.commissionId()], label: 'Back to my commission' }
      : { link: ['/designs', this.commissionId()], label: 'Back to the design' },
  );
  protected readonly kind = computed(() => {
    const k = this.card()?.commission.kind;
    return k ? ((COMMISSION_KIND.labels as Record<string, string>)[k] ?? 'piece').toLowerCase() : 'piece';
  });

  constructor() {
    effect(() =>
      this.api.careCard(this.commissionId()).subscribe({ next: (c) => this.card.set(c), error: () => this.failed.set(true) }),
    );
  }

  protected fibre(f: string): string {
    return f === 'unknown' ? 'Fibre not known' : ((FIBRE.labels as Record<string, string>)[f] ?? f);
  }

  protected print(): void {
    window.print();
  }

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'care-card');
  }
}
