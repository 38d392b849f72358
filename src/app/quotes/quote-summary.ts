import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { formatPounds } from '@keepstitch/shared';

import { LINE_KIND_LABELS, Quote, vatLabel } from './quote';
import { QuoteTotalsList } from './quote-totals-list';

/** A sent quote as it was frozen: its introduction, lines and totals. Read only. */
@Component({
  selector: 'ks-quote-summary',
  imports: [QuoteTotalsList],
  template: `
    @if (quote().intro) {
      <p class="intro">{{ quote().intro }}</p>
    }
    <div class="table-frame">
      <table class="lines">
        <caption class="ks-visually-hidden">Lines of quote version {{ quote().version }}</caption>
        <thead>
          <tr>
            <th scope="col">Item</th>
            <th scope="col" class="kind">Kind</th>
            <th scope="col" class="num">Quantity</th>
            <th scope="col" class="num">Price each</th>
            <th scope="col" class="num">Amount</th>
          </tr>
        </thead>
        <tbody>
          @for (line of quote().lines; track $index) {
            <tr data-testid="quote-line">
              <td>
                {{ line.description }}
                <span class="ks-phone-line">{{ kindLabels[line.kind] }}</span>
              </td>
              <td class="kind">{{ kindLabels[line.kind] }}</td>
              <td class="num">{{ line.quantity }} {{ line.unit }}</td>
              <td class="num">{{ pounds(line.unitPricePence) }}</td>
              <td class="num">{{ line.netPence === null || line.netPence === undefined ? '' : pounds(line.netPence) }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
    <ks-quote-totals-list [totals]="quote().totals" [vatLabel]="vat()" [depositPercent]="quote().depositPercent" />
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 1rem;
    }
    .intro {
      margin: 0;
      white-space: pre-line;
    }
    .table-frame {
      overflow-x: auto;
    }
    .lines {
      width: 100%;
      border-collapse: collapse;

      th,
      td {
        text-align: left;
        padding: 0.4rem 0.75rem 0.4rem 0;
        border-bottom: 1px solid var(--mat-sys-outline-variant);
      }
      th {
        font: var(--mat-sys-label-large);
      }
      .num {
        text-align: right;
        white-space: nowrap;
        font-variant-numeric: tabular-nums;
      }
    }
    /* On a phone the kind moves under the item, so the amounts fit without scrolling sideways. */
    @media (max-width: 599px) {
      .lines {
        th,
        td {
          padding-right: 0.5rem;
        }
        th:last-child,
        td:last-child {
          padding-right: 0;
        }
        .kind {
          display: none;
        }
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuoteSummary {
  readonly quote = input.required<Quote>();

  protected readonly kindLabels = LINE_KIND_LABELS;
  protected readonly vat = computed(() => vatLabel(this.quote()));

  protected pounds(pence: number): string {
    return formatPounds(pence);
  }
}
