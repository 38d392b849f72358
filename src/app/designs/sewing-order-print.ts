import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { DesignScreen } from './design';
import { DesignsApi } from './designs-api';

/** The piecing sequence of each block kind, then the top, with counts and pressing notes, as a page for paper. */
@Component({
  selector: 'ks-sewing-order-print',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './sewing-order-print.html',
  styleUrl: './sewing-order-print.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SewingOrderPrint {
  private readonly api = inject(DesignsApi);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly screen = signal<DesignScreen | null>(null);
  protected readonly failed = signal(false);
  protected readonly today = new Date();
  protected readonly sections = computed(() => this.screen()?.current?.derived.sewing ?? []);

  constructor() {
    effect(() =>
      this.api.screen(this.commissionId()).subscribe({ next: (s) => this.screen.set(s), error: () => this.failed.set(true) }),
    );
  }

  protected print(): void {
    window.print();
  }

  protected pdf(): string {
    return this.api.pdf(this.commissionId(), 'sewing-order');
  }
}
