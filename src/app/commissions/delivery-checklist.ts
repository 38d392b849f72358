import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { GARMENT_STATUS_LABELS, checkDelivery, custodyEnded, openCustody } from '@keepstitch/shared';

import { CommissionDetail, Garment } from './commission';
import { CustodyEndingForm } from './custody-ending-form';

/**
 * Delivery as a checklist: each garment with what returns to the client and
 * how its custody ended, or a form to end it. Delivery is offered under Stage
 * once none is open; the server checks the same rule.
 */
@Component({
  selector: 'ks-delivery-checklist',
  imports: [RouterLink, MatIconModule, CustodyEndingForm],
  templateUrl: './delivery-checklist.html',
  styleUrl: './delivery-checklist.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeliveryChecklist {
  readonly commission = input.required<CommissionDetail>();
  /** A garment's custody was recorded; the page reloads. */
  readonly changed = output<void>();

  protected readonly statusLabels = GARMENT_STATUS_LABELS;
  protected readonly garments = computed(() => this.commission().garments.map((g) => ({ ...g, status: g.status ?? 'expected' })));
  protected readonly open = computed(() => openCustody(this.garments()));
  protected readonly done = computed(() => this.garments().length - this.open().length);
  /** Why delivery is not offered yet, naming the garments; null once every custody has ended. */
  protected readonly waiting = computed(() => {
    const check = checkDelivery(this.open());
    return check.ok ? null : check.reason;
  });

  protected ended(g: Garment & { status: NonNullable<Garment['status']> }): boolean {
    return custodyEnded(g.status);
  }
}
