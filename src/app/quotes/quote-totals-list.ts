import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { formatPounds } from '@keepstitch/shared';

export interface TotalsView {
  netPence: number;
  vatPence: number;
  totalPence: number;
  depositPence: number;
  balancePence: number;
}

/** Subtotal, VAT, total, deposit and balance of a quote, as a list of terms. */
@Component({
  selector: 'ks-quote-totals-list',
  template: `
    <dl class="totals" data-testid="quote-totals">
      <div><dt>Subtotal</dt><dd data-testid="total-net">{{ pounds(totals().netPence) }}</dd></div>
      @if (vatLabel(); as label) {
        <div><dt>{{ label }}</dt><dd data-testid="total-vat">{{ pounds(totals().vatPence) }}</dd></div>
      } @else {
        <div><dt>VAT</dt><dd data-testid="total-vat">None charged</dd></div>
      }
      <div class="grand"><dt>Total</dt><dd data-testid="total-total">{{ pounds(totals().totalPence) }}</dd></div>
      <div><dt>Deposit ({{ depositPercent() }}%)</dt><dd data-testid="total-deposit">{{ pounds(totals().depositPence) }}</dd></div>
      <div><dt>Balance</dt><dd data-testid="total-balance">{{ pounds(totals().balancePence) }}</dd></div>
    </dl>
  `,
  styles: `
    .totals {
      display: grid;
      gap: 0.25rem;
      margin: 0;
      max-width: 24rem;

      div {
        display: flex;
        justify-content: space-between;
        gap: 1rem;
      }
      dt {
        color: var(--mat-sys-on-surface-variant);
      }
      dd {
        margin: 0;
        font-variant-numeric: tabular-nums;
      }
      .grand {
        font-weight: 600;
        border-top: 1px solid var(--mat-sys-outline-variant);
        padding-top: 0.25rem;

        dt {
          color: inherit;
        }
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuoteTotalsList {
  readonly totals = input.required<TotalsView>();
  readonly vatLabel = input<string | null>(null);
  readonly depositPercent = input<number | string>(0);

  protected pounds(pence: number): string {
    return formatPounds(pence);
  }
}
