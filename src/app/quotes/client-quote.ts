import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  Injector,
  afterNextRender,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { QUOTE_TEXT_LIMITS, formatPounds } from '@keepstitch/shared';
import { forkJoin } from 'rxjs';

import { showDate, showDateTime } from '../ui/dates';
import { messageFor } from '../core/api-error';
import { ExternalNavigation } from '../core/external-navigation';
import { Notices } from '../core/notices';
import { CautionCards, CautionView } from '../ui/caution-cards';
import { LoadStatus } from '../ui/load-status';
import { PAYMENT_KIND_LABELS, PAYMENT_METHOD_LABELS, PAYMENT_STATUS_LABELS, Payments, Quote } from './quote';
import { QuoteSummary } from './quote-summary';
import { QuotesApi } from './quotes-api';

/** How often, and how many times, the page asks whether a returning card payment has arrived. */
export const PAYMENT_POLL = { everyMs: 1500, times: 8 };

type PaymentNotice = 'confirming' | 'confirmed' | 'slow' | 'cancelled' | null;

/**
 * The client's quote on their commission page: the newest version sent to
 * them, accepting it with their typed name or declining it, then paying the
 * deposit and later the balance by card, and the payments so far.
 */
@Component({
  selector: 'ks-client-quote',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    CautionCards,
    QuoteSummary,
    LoadStatus,
  ],
  templateUrl: './client-quote.html',
  styleUrl: './client-quote.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientQuote {
  private readonly api = inject(QuotesApi);
  private readonly navigation = inject(ExternalNavigation);
  private readonly notices = inject(Notices);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  readonly commissionId = input.required<number>();
  readonly cautions = input<readonly CautionView[]>([]);
  /** `?quote=` from the e-mail's link: bring the quote into view. */
  readonly focusQuote = input<string | undefined>(undefined);
  /** `?payment=` on return from the card payment page: `done` or `cancelled`. */
  readonly payment = input<string | undefined>(undefined);
  /** The quote was answered or a payment arrived: the commission itself may have moved on. */
  readonly changed = output<void>();
  /** Once, when the first load has ended (shown or failed), so a page can show itself whole. */
  readonly firstLoadEnded = output<void>();

  protected readonly showDate = showDate;
  protected readonly showDateTime = showDateTime;
  protected readonly paymentKindLabels = PAYMENT_KIND_LABELS;
  protected readonly paymentStatusLabels = PAYMENT_STATUS_LABELS;

  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');
  protected readonly quote = signal<Quote | null>(null);
  protected readonly payments = signal<Payments | null>(null);
  protected readonly busy = signal<'accepting' | 'declining' | 'paying' | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly declineOpen = signal(false);
  protected readonly paymentNotice = signal<PaymentNotice>(null);
  /** Which payment the client went to make, remembered across the trip to the card payment page. */
  protected readonly paying = signal<'deposit' | 'balance'>('deposit');

  protected readonly acceptForm = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.minLength(2), Validators.maxLength(QUOTE_TEXT_LIMITS.acceptName)] }),
  });
  protected readonly declineForm = new FormGroup({
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(QUOTE_TEXT_LIMITS.declineNote)] }),
  });
  protected readonly name = this.acceptForm.controls.name;
  protected readonly note = this.declineForm.controls.note;

  protected readonly open = computed(() => {
    const q = this.quote();
    return !!q && q.status === 'sent' && !q.expired;
  });
  protected readonly due = computed(() => this.payments()?.due ?? null);
  /** A payment that reached the studio but not for the amount asked: the studio checks it, and nothing more is asked meanwhile. */
  protected readonly held = computed(() => (this.payments()?.items ?? []).find((p) => p.status === 'held') ?? null);
  protected readonly methodLabels = PAYMENT_METHOD_LABELS;

  protected receiptUrl(paymentId: number): string {
    return this.api.receiptUrl(this.commissionId(), paymentId);
  }

  protected invoiceUrl(): string {
    return this.api.invoiceUrl(this.commissionId());
  }
  protected readonly canPayDeposit = computed(() => {
    const q = this.quote();
    const due = this.due();
    return !this.held() && !!q && q.status === 'accepted' && !!due && due.quoteId === q.id && !due.depositPaid && due.depositPence > 0;
  });
  protected readonly canPayBalance = computed(() => {
    const due = this.due();
    return !this.held() && !!due && due.depositPaid && !due.balancePaid && due.balancePence > 0;
  });

  private pollTimer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    effect(() => {
      const id = this.commissionId();
      untracked(() => this.load(id, true));
    });
    inject(DestroyRef).onDestroy(() => this.stopPolling());
  }

  protected load(id = this.commissionId(), first = false): void {
    // Trying again after a failure shows the bar; a reload of a shown quote keeps it in place.
    if (this.state() === 'failed') this.state.set('loading');
    forkJoin({ quotes: this.api.list(id), payments: this.api.payments(id) }).subscribe({
      next: ({ quotes, payments }) => {
        this.quote.set(quotes[0] ?? null);
        this.payments.set(payments);
        this.state.set('ready');
        if (first) {
          // The page shows itself first, so the payment notice below fills a live region that can be
          // seen, and a screen reader hears it.
          this.firstLoadEnded.emit();
          afterNextRender(() => this.arrived(), { injector: this.injector });
        }
      },
      error: () => {
        this.state.set('failed');
        if (first) this.firstLoadEnded.emit();
      },
    });
  }

  protected acceptQuote(): void {
    const q = this.quote();
    this.error.set(null);
    if (!q) return;
    if (this.name.invalid) {
      this.name.markAsTouched();
      return;
    }
    this.busy.set('accepting');
    this.api.accept(q.id, this.name.value.trim()).subscribe({
      next: (accepted) => {
        this.busy.set(null);
        this.quote.set(accepted);
        this.notices.info('Thank you: the quote is accepted.');
        this.refreshPayments();
        this.changed.emit();
      },
      error: (error: unknown) => this.refused(error),
    });
  }

  protected declineQuote(): void {
    const q = this.quote();
    this.error.set(null);
    if (!q || this.note.invalid) {
      this.note.markAsTouched();
      return;
    }
    this.busy.set('declining');
    this.api.decline(q.id, this.note.value.trim() || undefined).subscribe({
      next: (declined) => {
        this.busy.set(null);
        this.declineOpen.set(false);
        this.quote.set(declined);
        this.notices.info('Your answer is sent to the studio.');
        this.changed.emit();
      },
      error: (error: unknown) => this.refused(error),
    });
  }

  /**
   * An answer the server refused. A conflict means the quote moved on meanwhile
   * (answered in another tab, or replaced by a newer version): the part loads
   * again so it shows where the quote stands, with the server's message.
   */
  private refused(error: unknown): void {
    this.busy.set(null);
    this.error.set(messageFor(error));
    if ((error as { status?: number }).status === 409) this.load();
  }

  /** Off to the hosted card payment page; the studio's server never sees the card. */
  protected payDeposit(): void {
    const q = this.quote();
    if (!q) return;
    this.startPayment('deposit', this.api.depositCheckout(q.id));
  }

  protected payBalance(): void {
    this.startPayment('balance', this.api.balanceCheckout(this.commissionId()));
  }

  protected pdfUrl(q: Quote): string {
    return this.api.pdfUrl(q.id);
  }

  protected pounds(pence: number): string {
    return formatPounds(pence);
  }

  private startPayment(kind: 'deposit' | 'balance', checkout: ReturnType<QuotesApi['depositCheckout']>): void {
    this.error.set(null);
    this.remember(kind);
    this.paymentNotice.set(null);
    this.busy.set('paying');
    checkout.subscribe({
      next: (url) => this.navigation.goTo(url),
      error: (error: unknown) => {
        this.busy.set(null);
        this.error.set(messageFor(error));
      },
    });
  }

  /** What the address asked for when the page opened: a returning payment, or the quote from the e-mail. */
  private arrived(): void {
    const payment = this.payment();
    this.paying.set(this.recalled());
    if (payment === 'done') {
      this.paymentNotice.set(this.settled() ? 'confirmed' : 'confirming');
      if (!this.settled()) this.poll(PAYMENT_POLL.times);
      else this.changed.emit();
    } else if (payment === 'cancelled') {
      this.paymentNotice.set('cancelled');
    }
    if (payment || this.focusQuote()) {
      afterNextRender(() => this.host.nativeElement.scrollIntoView?.({ block: 'start' }), { injector: this.injector });
    }
  }

  /** True once the payments show the payment the client went to make as paid. */
  private settled(): boolean {
    const due = this.due();
    if (!due) return false;
    return this.paying() === 'balance' ? due.balancePaid : due.depositPaid;
  }

  private storageKey(): string {
    return `keepstitch.paying.${this.commissionId()}`;
  }

  private remember(kind: 'deposit' | 'balance'): void {
    try {
      sessionStorage.setItem(this.storageKey(), kind);
    } catch {
      // Storage may be switched off: the deposit is then assumed.
    }
  }

  private recalled(): 'deposit' | 'balance' {
    try {
      return sessionStorage.getItem(this.storageKey()) === 'balance' ? 'balance' : 'deposit';
    } catch {
      return 'deposit';
    }
  }

  private poll(left: number): void {
    this.stopPolling();
    this.pollTimer = setTimeout(() => {
      this.pollTimer = null;
      this.api.payments(this.commissionId()).subscribe({
        next: (payments) => {
          this.payments.set(payments);
          if (this.settled()) {
            this.paymentNotice.set('confirmed');
            this.changed.emit();
          } else if (left > 1) {
            this.poll(left - 1);
          } else {
            this.paymentNotice.set('slow');
          }
        },
        error: () => (left > 1 ? this.poll(left - 1) : this.paymentNotice.set('slow')),
      });
    }, PAYMENT_POLL.everyMs);
  }

  private refreshPayments(): void {
    this.api.payments(this.commissionId()).subscribe({ next: (payments) => this.payments.set(payments) });
  }

  private stopPolling(): void {
    if (this.pollTimer !== null) clearTimeout(this.pollTimer);
    this.pollTimer = null;
  }
}
