import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, FormArray, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { QUOTE_TEXT_LIMITS, formatPounds, learnedHours, parsePounds, quoteTotals } from '@keepstitch/shared';
import Decimal from 'decimal.js';
import { Observable, filter, of, switchMap } from 'rxjs';

import { apiErrorOf, messageFor } from '../core/api-error';
import { keepUnsavedWork } from '../core/unsaved-work';
import { ConfirmDialog, ConfirmDialogData } from '../core/confirm-dialog';
import { LINE_KINDS, LINE_KIND_LABELS, LineKind, Quote, QuoteDraft, QuoteLine, QuoteSuggestion, vatLabel } from './quote';
import { QuoteTotalsList, TotalsView } from './quote-totals-list';
import { QuotesApi } from './quotes-api';

const QUANTITY = /^\d{1,8}(\.\d{1,4})?$/;

function quantityText(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  return QUANTITY.test(text) && Number(text) > 0 ? null : { quantity: true };
}

/** A price in pounds whose sign suits the line: a discount below zero, everything else zero or more. */
function priceForKind(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const pence = parsePounds(text);
  if (pence === null) return { pounds: true };
  const kind = control.parent?.get('kind')?.value as LineKind | undefined;
  if (kind === 'discount' && pence >= 0) return { discountSign: true };
  if (kind !== 'discount' && pence < 0) return { negative: true };
  return null;
}

type LineForm = FormGroup<{
  kind: FormControl<LineKind>;
  description: FormControl<string>;
  quantity: FormControl<string>;
  unit: FormControl<string>;
  unitPrice: FormControl<string>;
  stage: FormControl<string | null>;
}>;

function poundsText(pence: number): string {
  return formatPounds(pence).replace('\u00a3', '').replace(/,/g, '');
}

/** Edits a draft quote: its lines, introduction and deposit, with the totals worked out as you type. */
@Component({
  selector: 'ks-quote-editor',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    QuoteTotalsList,
  ],
  templateUrl: './quote-editor.html',
  styleUrl: './quote-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuoteEditor {
  private readonly api = inject(QuotesApi);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);

  /** The draft being edited. */
  readonly quote = input.required<Quote>();
  /** The studio's hourly rate, offered as the price of a new labour line. */
  readonly hourlyRatePence = input<number | null>(null);
  readonly saved = output<Quote>();
  readonly sent = output<Quote>();

  protected readonly kinds = LINE_KINDS;
  protected readonly kindLabels = LINE_KIND_LABELS;

  protected readonly form = new FormGroup({
    intro: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(QUOTE_TEXT_LIMITS.intro)] }),
    depositPercent: new FormControl<number | null>(null, [Validators.required, Validators.min(0), Validators.max(100)]),
    lines: new FormArray<LineForm>([]),
  });
  protected readonly lines = this.form.controls.lines;
  protected readonly busy = signal<'saving' | 'sending' | null>(null);
  protected readonly error = signal<string | null>(null);

  /** Bumped on every edit, so the totals below follow the form. */
  private readonly edits = signal(0);
  protected readonly vat = computed(() => vatLabel(this.quote()));
  protected readonly depositShown = computed(() => {
    this.edits();
    return this.form.controls.depositPercent.value ?? 0;
  });
  /** Each line's amount in pence (null while it cannot be worked out yet). */
  protected readonly lineAmounts = computed(() => {
    this.edits();
    return this.lines.controls.map((line) => {
      const { quantity, unitPrice } = line.getRawValue();
      const pence = parsePounds(unitPrice);
      if (!QUANTITY.test(quantity.trim()) || Number(quantity) <= 0 || pence === null) return null;
      return new Decimal(quantity.trim()).times(pence).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();
    });
  });
  protected readonly totals = computed<TotalsView | null>(() => {
    this.edits();
    const draft = this.draftOrNull();
    if (!draft) return null;
    try {
      return quoteTotals({ lines: draft.lines, vatRate: this.quote().vatRate, vatMode: this.quote().vatMode, depositPercent: draft.depositPercent ?? 0 });
    } catch {
      return null;
    }
  });
  /** The design's suggestion for this commission: its notes, and the labour ratios learned from finished commissions. */
  protected readonly suggestion = signal<QuoteSuggestion | null>(null);
  private suggestionFor: number | null = null;
  /** Each line's quantity as the draft was opened, which a learned ratio is applied to (so applying it twice does not grow it twice). */
  private readonly openedQuantity = new WeakMap<LineForm, string>();
  /** For each labour line of a stage the studio has learned about: the hours the ratio gives, its basis, and whether they are in use. */
  protected readonly learned = computed(() => {
    this.edits();
    const learned = this.suggestion()?.learned ?? [];
    return this.lines.controls.map((line) => {
      const { kind, stage, quantity } = line.getRawValue();
      const ratio = kind === 'labour' && stage ? learned.find((l) => l.stage === stage) : undefined;
      const base = (this.openedQuantity.get(line) ?? quantity).trim();
      if (!ratio || !QUANTITY.test(base) || Number(base) <= 0) return null;
      const hours = learnedHours(base, ratio.ratio);
      return { hours, basis: ratio.basis, used: quantity.trim() === hours };
    });
  });
  protected readonly totalsProblem = computed(() => {
    this.edits();
    if (this.totals()) return null;
    return this.lines.length === 0 ? 'Add a line to see the totals.' : 'The totals appear when every line has a quantity and a price, and the discount is not larger than the rest.';
  });

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
    this.form.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.edits.update((n) => n + 1));
    effect(() => {
      const quote = this.quote();
      untracked(() => {
        this.fill(quote);
        this.loadSuggestion(quote.commissionId);
      });
    });
  }

  /** Takes the learned estimate for a line: its quantity becomes the hours the ratio gives. */
  protected useLearned(index: number): void {
    const learned = this.learned()[index];
    if (!learned) return;
    this.lines.at(index).controls.quantity.setValue(learned.hours);
    this.form.markAsDirty();
  }

  /** Once per commission; without it the editor works as before (the suggestion only advises). */
  private loadSuggestion(commissionId: number): void {
    if (this.suggestionFor === commissionId) return;
    this.suggestionFor = commissionId;
    this.api
      .suggestion(commissionId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (s) => this.suggestion.set(s), error: () => this.suggestion.set(null) });
  }

  protected pounds(pence: number): string {
    return formatPounds(pence);
  }

  protected addLine(kind: LineKind = 'material'): void {
    const rate = this.hourlyRatePence();
    this.lines.push(
      this.lineForm({
        kind,
        description: '',
        quantity: '1',
        unit: kind === 'labour' ? 'hours' : 'item',
        unitPricePence: kind === 'labour' && rate !== null ? rate : 0,
        stage: null,
      }, kind !== 'labour' || rate === null),
    );
    this.form.markAsDirty();
  }

  protected removeLine(index: number): void {
    this.lines.removeAt(index);
    this.form.markAsDirty();
  }

  protected saveQuote(): void {
    this.save().subscribe({
      next: (quote) => {
        this.form.markAsPristine();
        this.saved.emit(quote);
      },
    });
  }

  /** Asks first: sending e-mails the client and freezes this version. Unsaved changes are saved before it goes. */
  protected sendQuote(): void {
    if (!this.checkForm()) return;
    const data: ConfirmDialogData = {
      title: `Send version ${this.quote().version} to the client?`,
      message: 'The client will be e-mailed this quote with its PDF and a link to accept it. Once sent, this version is frozen: to change anything later you make a new version.',
      confirmLabel: 'Send quote',
      cancelLabel: 'Keep editing',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => (this.form.dirty ? this.save() : of(this.quote()))),
        switchMap((quote) => {
          this.busy.set('sending');
          return this.api.send(quote.id);
        }),
      )
      .subscribe({
        next: (quote) => {
          this.busy.set(null);
          this.form.markAsPristine();
          this.sent.emit(quote);
        },
        error: (error: unknown) => {
          this.busy.set(null);
          this.error.set(messageFor(error));
        },
      });
  }

  private checkForm(): boolean {
    this.error.set(null);
    if (this.lines.length === 0) {
      this.error.set('A quote needs at least one line: add one before saving.');
      return false;
    }
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.error.set('Some lines need a change: see the messages under the fields.');
      return false;
    }
    if (!this.totals()) {
      this.error.set('The discount is larger than the rest of the quote: the total would be below zero.');
      return false;
    }
    return true;
  }

  private save(): Observable<Quote> {
    if (!this.checkForm()) return new Observable<Quote>((subscriber) => subscriber.complete());
    this.busy.set('saving');
    return new Observable<Quote>((subscriber) => {
      const subscription = this.api.update(this.quote().id, this.draftOrNull()!).subscribe({
        next: (quote) => {
          this.busy.set(null);
          subscriber.next(quote);
          subscriber.complete();
        },
        error: (error: unknown) => {
          this.busy.set(null);
          const fields = apiErrorOf(error)?.fields;
          this.error.set(fields?.['lines'] ?? messageFor(error));
          subscriber.complete();
        },
      });
      return () => subscription.unsubscribe();
    });
  }

  /** The form as the API wants it, or null while some line is unfinished. */
  private draftOrNull(): QuoteDraft | null {
    const v = this.form.getRawValue();
    const lines: QuoteDraft['lines'] = [];
    for (const line of v.lines) {
      const pence = parsePounds(line.unitPrice);
      const quantity = line.quantity.trim();
      if (pence === null || !QUANTITY.test(quantity) || Number(quantity) <= 0) return null;
      lines.push({
        kind: line.kind,
        description: line.description.trim(),
        quantity,
        unit: line.unit.trim() || 'item',
        unitPricePence: pence!,
        ...(line.stage ? { stage: line.stage } : {}),
      });
    }
    if (lines.length === 0) return null;
    return { intro: v.intro.trim(), lines, depositPercent: v.depositPercent ?? 0 };
  }

  private fill(quote: Quote): void {
    this.lines.clear({ emitEvent: false });
    this.form.reset({ intro: quote.intro ?? '', depositPercent: quote.depositPercent });
    for (const line of quote.lines) {
      const form = this.lineForm(line, false);
      this.openedQuantity.set(form, line.quantity);
      this.lines.push(form);
    }
    this.error.set(null);
  }

  private lineForm(line: Pick<QuoteLine, 'kind' | 'description' | 'quantity' | 'unit' | 'unitPricePence' | 'stage'>, blankPrice: boolean): LineForm {
    const group: LineForm = new FormGroup({
      kind: new FormControl<LineKind>(line.kind, { nonNullable: true }),
      description: new FormControl(line.description, { nonNullable: true, validators: [Validators.required, Validators.maxLength(QUOTE_TEXT_LIMITS.lineDescription)] }),
      quantity: new FormControl(line.quantity, { nonNullable: true, validators: [Validators.required, quantityText] }),
      unit: new FormControl(line.unit, { nonNullable: true, validators: [Validators.maxLength(QUOTE_TEXT_LIMITS.lineUnit)] }),
      unitPrice: new FormControl(blankPrice ? '' : poundsText(line.unitPricePence), { nonNullable: true, validators: [Validators.required, priceForKind] }),
      stage: new FormControl<string | null>(line.stage ?? null, { nonNullable: true }),
    });
    // The price's sign depends on the kind, which the validator can only see once the group exists.
    group.controls.unitPrice.updateValueAndValidity({ emitEvent: false });
    group.controls.kind.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      group.controls.unitPrice.updateValueAndValidity();
      group.controls.unitPrice.markAsTouched();
    });
    return group;
  }
}
