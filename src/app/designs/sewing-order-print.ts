import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';

import { DesignScreen } from './design';
import { DesignsApi } from './designs-api';
import { PrintBar, PrintLoad } from './print-bar';

/** The piecing sequence of each block kind, then the top, with counts and pressing notes, as a page for paper. */
@Component({
  selector: 'ks-sewing-order-print',
  imports: [DatePipe, MatButtonModule, PrintBar],
  templateUrl: './sewing-order-print.html',
  styleUrl: './sewing-order-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SewingOrderPrint {
  private readonly api = inject(DesignsApi);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly loaded = new PrintLoad<DesignScreen>(() => this.api.screen(this.commissionId()));
  protected readonly screen = this.loaded.value;
  protected readonly today = new Date();
  protected readonly sections = computed(() => this.screen()?.current?.derived.sewing ?? []);

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'sewing-order');
  }
}
