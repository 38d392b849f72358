import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { PAYMENT_TEXT_LIMITS, Stage, formatPounds } from '@keepstitch/shared';
import { filter, forkJoin, switchMap } from 'rxjs';

import { showDate, showDateTime } from '../ui/dates';
import { messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { SettingsApi } from '../settings/settings-api';
import { FieldError } from '../ui/field-error';
import { LoadStatus } from '../ui/load-status';
import { ConfirmDialog, ConfirmDialogData } from '../core/confirm-dialog';
import { PAYMENT_KIND_LABELS, PAYMENT_METHOD_LABELS, PAYMENT_STATUS_LABELS, Payment, Payments, QUOTE_STATUS_LABELS, Quote, QuoteDraft, REFUND_REASON_LABELS } from './quote';
import { QuoteEditor } from './quote-editor';
import { QuoteSummary } from './quote-summary';
import { QuotesApi } from './quotes-api';
import { RecordPaymentForm } from './record-payment-form';

/**
 * The owner's quotes and payments for one commission: every version, the
 * editor for a draft, the frozen view of a sent one, and the payments with
 * the deposit refund after a cancellation. A payment that needs the owner's
 * answer (held because it is not the amount asked, or a second payment whose
 * refund has not gone through) is shown first, with what to do about it.
 * Never shown to the workroom.
 */
@Component({
  selector: 'ks-quote-section',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, QuoteEditor, QuoteSummary, LoadStatus, RecordPaymentForm, FieldError],
  templateUrl: './quote-section.html',
  styleUrl: './quote-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuoteSection {
  private readonly api = inject(QuotesApi);
  private readonly settingsApi = inject(SettingsApi);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);

  readonly commissionId = input.required<number>();
  readonly stage = input.required<Stage>();
  /** Sending a quote, refunding a deposit or accepting a held payment can change the commission (its stage). */
  readonly changed = output<void>();

  protected readonly statusLabels = QUOTE_STATUS_LABELS;
  protected readonly paymentKindLabels = PAYMENT_KIND_LABELS;
  protected readonly paymentStatusLabels = PAYMENT_STATUS_LABELS;
  protected readonly showDate = showDate;
  protected readonly showDateTime = showDateTime;

  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');
  protected readonly quotes = signal<Quote[]>([]);
  protected readonly payments = signal<Payments | null>(null);
  protected readonly hourlyRatePence = signal<number | null>(null);
  protected readonly defaultDeposit = signal<number | null>(null);
  protected readonly selectedId = signal<number | null>(null);
  protected readonly creating = signal(false);
  protected readonly refunding = signal(false);
  /** The payment being accepted or refunded just now. */
  protected readonly answering = signal<number | null>(null);
  /** The form for cash or a bank transfer is open. */
  protected readonly recording = signal(false);
  protected readonly methodLabels = PAYMENT_METHOD_LABELS;
  /** The payment recorded by hand that the owner is undoing, and why. */
  protected readonly undoing = signal<Payment | null>(null);
  protected readonly undoNote = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.pattern(/\S/), Validators.maxLength(PAYMENT_TEXT_LIMITS.undoNote)] });
  protected readonly undoLimit = PAYMENT_TEXT_LIMITS.undoNote;
  protected readonly undoError = signal<string | null>(null);
  /** Something is still owed on the accepted quote, so a payment may be recorded. */
  protected readonly canRecord = computed(() => {
    const due = this.payments()?.due;
    return !!due && (!due.depositPaid || (!due.balancePaid && due.balancePence > 0));
  });
  protected readonly actionError = signal<string | null>(null);

  protected readonly selected = computed<Quote | null>(() => {
    const list = this.quotes();
    return list.find((q) => q.id === this.selectedId()) ?? list[0] ?? null;
  });
  protected readonly hasDraft = computed(() => this.quotes().some((q) => q.status === 'draft'));
  protected readonly closed = computed(() => this.stage() === 'delivered' || this.stage() === 'cancelled');
  protected readonly canRefund = computed(
    () => this.stage() === 'cancelled' && (this.payments()?.items ?? []).some((p) => p.kind === 'deposit' && p.status === 'paid'),
  );

  /** Payments waiting for the owner: held for review, or paid twice and not yet refunded. */
  protected readonly toAnswer = computed(() => (this.payments()?.items ?? []).filter((p) => p.status === 'held' || p.status === 'overpaid'));

  constructor() {
    effect(() => {
      const id = this.commissionId();
      untracked(() => this.load(id));
    });
  }

  protected load(id = this.commissionId()): void {
    this.state.set('loading');
    forkJoin({ quotes: this.api.list(id), payments: this.api.payments(id), settings: this.settingsApi.get() }).subscribe({
      next: ({ quotes, payments, settings }) => {
        this.quotes.set(quotes);
        this.payments.set(payments);
        this.hourlyRatePence.set(settings.hourlyRatePence);
        this.defaultDeposit.set(Number(settings.depositPercent));
        this.state.set('ready');
      },
      error: () => this.state.set('failed'),
    });
  }

  protected select(quote: Quote): void {
    this.selectedId.set(quote.id);
  }

  /**
   * A new draft version. It starts from the newest version's lines; the first
   * one, or one asked for "from the design", is priced from the current design
   * (falling back to one labour line at the hourly rate when there is none).
   */
  protected newQuote(fromDesign = false): void {
    const latest = this.quotes()[0];
    const deposit = latest ? { depositPercent: latest.depositPercent } : this.defaultDeposit() !== null ? { depositPercent: this.defaultDeposit()! } : {};
    const blank: QuoteDraft = {
      lines: [{ kind: 'labour', description: 'Making: piecing, quilting and binding', quantity: '1', unit: 'hours', unitPricePence: this.hourlyRatePence() ?? 0 }],
      ...deposit,
    };
    this.creating.set(true);
    this.actionError.set(null);
    if (latest && !fromDesign) {
      this.createDraft({
        intro: latest.intro ?? '',
        lines: latest.lines.map((l) => ({ kind: l.kind, description: l.description, quantity: l.quantity, unit: l.unit, unitPricePence: l.unitPricePence, ...(l.stage ? { stage: l.stage } : {}) })),
        ...deposit,
      });
      return;
    }
    this.api.suggestion(this.commissionId()).subscribe({
      next: (suggestion) => {
        if (fromDesign && suggestion.lines.length === 0) {
          this.creating.set(false);
          this.actionError.set('There is no design to price from yet: save a design for this commission first.');
          return;
        }
        this.createDraft(suggestion.lines.length ? { lines: suggestion.lines, ...deposit } : blank);
      },
      error: () => (fromDesign ? (this.creating.set(false), this.actionError.set('The design could not be priced just now; try again.')) : this.createDraft(blank)),
    });
  }

  private createDraft(draft: QuoteDraft): void {
    this.api.create(this.commissionId(), draft).subscribe({
      next: (quote) => {
        this.creating.set(false);
        this.quotes.update((list) => [quote, ...list]);
        this.selectedId.set(quote.id);
        this.notices.info(`Draft version ${quote.version} started.`);
      },
      error: (error: unknown) => {
        this.creating.set(false);
        this.actionError.set(messageFor(error));
      },
    });
  }

  protected quoteSaved(quote: Quote): void {
    this.replace(quote);
    this.notices.info(`Version ${quote.version} saved.`);
  }

  protected quoteSent(quote: Quote): void {
    this.notices.info(`Version ${quote.version} sent to the client.`);
    this.selectedId.set(quote.id);
    this.load();
    this.changed.emit();
  }

  protected refundDeposit(): void {
    const deposit = this.payments()?.items.find((p) => p.kind === 'deposit' && p.status === 'paid');
    if (!deposit) return;
    const data: ConfirmDialogData = {
      title: 'Refund the deposit?',
      message: `${formatPounds(deposit.amountPence)} goes back to the client’s card. This cannot be undone.`,
      confirmLabel: 'Refund deposit',
      cancelLabel: 'Keep it',
    };
    this.actionError.set(null);
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => {
          this.refunding.set(true);
          return this.api.refundDeposit(this.commissionId());
        }),
      )
      .subscribe({
        next: () => {
          this.refunding.set(false);
          this.notices.info('The deposit is refunded.');
          this.load();
        },
        error: (error: unknown) => {
          this.refunding.set(false);
          this.actionError.set(messageFor(error));
        },
      });
  }

  /** A payment recorded by hand is in: the list and what is due are read again. */
  protected paymentRecorded(p: Payment): void {
    this.recording.set(false);
    this.notices.info(`${this.paymentKindLabels[p.kind] ?? p.kind} of ${this.pounds(this.received(p))} recorded; the client has been sent a receipt.`);
    this.api.payments(this.commissionId()).subscribe({ next: (payments) => this.payments.set(payments), error: () => this.state.set('failed') });
  }

  protected startUndo(p: Payment): void {
    this.undoNote.reset('');
    this.undoError.set(null);
    this.undoing.set(p);
  }

  protected undoPayment(): void {
    const p = this.undoing();
    if (!p) return;
    if (this.undoNote.invalid) {
      this.undoNote.markAsTouched();
      return;
    }
    this.undoError.set(null);
    this.api.undoPayment(this.commissionId(), p.id, this.undoNote.value.trim()).subscribe({
      next: () => {
        this.undoing.set(null);
        this.notices.info(`${this.paymentKindLabels[p.kind] ?? p.kind} of ${this.pounds(this.received(p))} undone; it no longer counts.`);
        this.api.payments(this.commissionId()).subscribe({ next: (payments) => this.payments.set(payments), error: () => this.state.set('failed') });
      },
      error: (error: unknown) => this.undoError.set(messageFor(error)),
    });
  }

  protected receiptUrl(p: Payment): string {
    return this.api.receiptUrl(this.commissionId(), p.id);
  }

  protected invoiceUrl(): string {
    return this.api.invoiceUrl(this.commissionId());
  }

  /** What a payment counts for: what arrived, once it did. */
  protected received(p: Payment): number {
    return p.receivedPence ?? p.amountPence;
  }

  protected statusLabel(p: Payment): string {
    if (p.status === 'refunded' && p.refundReason) return REFUND_REASON_LABELS[p.refundReason] ?? 'Refunded';
    return this.paymentStatusLabels[p.status] ?? p.status;
  }

  /** What accepting a held payment leads to, in words. */
  protected acceptEffect(p: Payment): string {
    if (p.kind === 'balance') return `it counts as the balance and the commission as paid in full`;
    const balance = this.payments()?.due?.balancePence;
    const after = balance === undefined ? '' : `, and the balance becomes ${formatPounds(Math.max(0, balance - this.received(p)))}`;
    return `the commission is booked and the client gets a receipt for ${formatPounds(this.received(p))}${after}`;
  }

  protected acceptPayment(p: Payment): void {
    const amount = formatPounds(this.received(p));
    this.answer(p, {
      data: { title: `Accept ${amount} as the ${p.kind}?`, message: `It counts from now: ${this.acceptEffect(p)}.`, confirmLabel: `Accept ${amount}`, cancelLabel: 'Not yet' },
      call: () => this.api.acceptPayment(this.commissionId(), p.id),
      done: `${amount} is accepted as the ${p.kind}.`,
    });
  }

  protected refundPayment(p: Payment): void {
    const amount = formatPounds(this.received(p));
    this.answer(p, {
      data: { title: `Refund ${amount}?`, message: `${amount} goes back to the client’s card. This cannot be undone.`, confirmLabel: `Refund ${amount}`, cancelLabel: 'Keep it' },
      call: () => this.api.refundPayment(this.commissionId(), p.id),
      done: `${amount} is refunded to the client.`,
    });
  }

  private answer(p: Payment, step: { data: ConfirmDialogData; call: () => ReturnType<QuotesApi['acceptPayment']>; done: string }): void {
    this.actionError.set(null);
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data: step.data })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => {
          this.answering.set(p.id);
          return step.call();
        }),
      )
      .subscribe({
        next: () => {
          this.answering.set(null);
          this.notices.info(step.done);
          this.load();
          this.changed.emit();
        },
        error: (error: unknown) => {
          this.answering.set(null);
          this.actionError.set(messageFor(error));
        },
      });
  }

  protected pdfUrl(quote: Quote): string {
    return this.api.pdfUrl(quote.id);
  }

  protected pounds(pence: number): string {
    return formatPounds(pence);
  }

  private replace(quote: Quote): void {
    this.quotes.update((list) => list.map((q) => (q.id === quote.id ? quote : q)));
  }
}
