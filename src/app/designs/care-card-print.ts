import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { COMMISSION_KIND, fibreLine, fibreName } from '@keepstitch/shared';

import { Auth } from '../core/auth';
import { CareCard } from './design';
import { DesignsApi } from './designs-api';
import { PrintBar, PrintLoad } from './print-bar';

/** The care card for the finished piece as a page for paper; the client reaches it from the portal. */
@Component({
  selector: 'ks-care-card-print',
  imports: [MatButtonModule, PrintBar],
  templateUrl: './care-card-print.html',
  styleUrl: './care-card-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CareCardPrint {
  private readonly api = inject(DesignsApi);
  private readonly auth = inject(Auth);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly loaded = new PrintLoad<CareCard>(() => this.api.careCard(this.commissionId()));
  protected readonly card = this.loaded.value;
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

  protected readonly fibre = fibreName;
  protected readonly line = fibreLine;

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'care-card');
  }
}
