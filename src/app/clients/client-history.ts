import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { STAGE_LABELS, formatPounds, type Stage } from '@keepstitch/shared';

import { LoadStatus } from '../ui/load-status';
import { showDate } from '../ui/dates';
import { ClientRecord } from './client';
import { ClientsApi } from './clients-api';

const QUOTE_WORDS: Readonly<Record<string, string | undefined>> = { sent: 'Sent', accepted: 'Accepted', declined: 'Declined', superseded: 'Replaced by a later version' };
const PAYMENT_WORDS: Readonly<Record<string, string | undefined>> = { paid: 'Paid', held: 'Held for checking', overpaid: 'Paid twice: to be refunded', refunded: 'Refunded', undone: 'Undone', failed: 'Not completed' };
const METHOD_WORDS: Readonly<Record<string, string | undefined>> = { card: 'card', cash: 'cash', bank_transfer: 'bank transfer' };

/**
 * The client's page below their details: their commissions (each a link to
 * its page), the quotes sent on them and the payments made, with a way to
 * start a new commission for this client.
 */
@Component({
  selector: 'ks-client-history',
  imports: [RouterLink, MatButtonModule, MatIconModule, LoadStatus],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="client-history-heading" class="client-history">
      <div class="heading">
        <h2 id="client-history-heading">Commissions, quotes and payments</h2>
        <a mat-flat-button routerLink="/commissions/new" [queryParams]="{ client: clientId() }"><mat-icon>add</mat-icon>New commission for this client</a>
      </div>
      <ks-load-status what="this client’s commissions" [loading]="state() === 'loading'" [failed]="state() === 'failed'" (retry)="load()" />
      @if (record(); as r) {
        <h3 id="client-commissions">Commissions</h3>
        @if (r.commissions.length === 0) {
          <p class="empty">No commissions yet.</p>
        } @else {
          <ul aria-labelledby="client-commissions" data-testid="client-commissions">
            @for (c of r.commissions; track c.id) {
              <li><a [routerLink]="['/commissions', c.id]">{{ c.title }}</a>: {{ stageLabel(c.stage) }}{{ c.deadline ? ', due ' + date(c.deadline) : '' }}</li>
            }
          </ul>
        }
        <h3 id="client-quotes">Quotes</h3>
        @if (r.quotes.length === 0) {
          <p class="empty">No quotes sent yet.</p>
        } @else {
          <ul aria-labelledby="client-quotes" data-testid="client-quotes">
            @for (q of r.quotes; track q.id) {
              <li>{{ titleOf(q.commissionId) }}, version {{ q.version }}: {{ pounds(q.totalPence) }}, {{ quoteWord(q.status) }}{{ q.sentAt ? ' (sent ' + date(q.sentAt) + ')' : '' }}</li>
            }
          </ul>
        }
        <h3 id="client-payments">Payments</h3>
        @if (r.payments.length === 0) {
          <p class="empty">No payments yet.</p>
        } @else {
          <ul aria-labelledby="client-payments" data-testid="client-payments">
            @for (p of r.payments; track p.id) {
              <li>
                {{ titleOf(p.commissionId) }}: {{ p.kind === 'deposit' ? 'deposit' : 'balance' }} {{ pounds(p.receivedPence ?? p.amountPence) }} by {{ methodWord(p.method) }}, {{ paymentWord(p.status) }}{{ p.paidAt ? ' ' + date(p.paidAt) : '' }}
                @if (p.receiptNumber) {
                  <a [href]="'/api/commissions/' + p.commissionId + '/payments/' + p.id + '/receipt'" target="_blank" rel="noopener">Receipt R-{{ p.receiptNumber.toString().padStart(4, '0') }}</a>
                }
              </li>
            }
          </ul>
        }
      }
    </section>
  `,
  styles: `
    .heading { display: flex; flex-wrap: wrap; align-items: center; justify-content: space-between; gap: 8px; }
    ul { padding-left: 1.25rem; }
    li { margin: 4px 0; }
    .empty { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class ClientHistory {
  private readonly api = inject(ClientsApi);
  readonly clientId = input.required<number>();
  protected readonly record = signal<ClientRecord | null>(null);
  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');

  constructor() {
    effect(() => this.load(this.clientId()));
  }

  load(id = this.clientId()): void {
    this.state.set('loading');
    this.api.record(id).subscribe({
      next: (r) => {
        this.record.set(r);
        this.state.set('ready');
      },
      error: () => this.state.set('failed'),
    });
  }

  protected titleOf(commissionId: number): string {
    return this.record()?.commissions.find((c) => c.id === commissionId)?.title ?? 'A commission';
  }

  protected stageLabel(stage: string): string {
    return STAGE_LABELS[stage as Stage] ?? stage;
  }

  protected quoteWord(status: string): string {
    return (QUOTE_WORDS[status] ?? status).toLowerCase();
  }

  protected paymentWord(status: string): string {
    return (PAYMENT_WORDS[status] ?? status).toLowerCase();
  }

  protected methodWord(method: string): string {
    return METHOD_WORDS[method] ?? method;
  }

  protected pounds(pence: number | null): string {
    return pence === null ? 'not priced' : formatPounds(pence);
  }

  protected date(iso: string): string {
    return showDate(iso.slice(0, 10));
  }
}
