import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { PAYMENT_TEXT_LIMITS, formatPounds, parsePounds } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { keepUnsavedWork } from '../core/unsaved-work';
import { FieldError } from '../ui/field-error';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { ManualPayment, Payment } from './quote';
import { QuotesApi } from './quotes-api';

/** An amount in pounds, more than nothing. */
function pounds(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const pence = parsePounds(text);
  if (pence === null) return { pounds: true };
  return pence > 0 ? null : { positive: true };
}

/** A day that is not in the future (money recorded has arrived). */
function notAhead(control: AbstractControl): ValidationErrors | null {
  const day = String(control.value ?? '');
  return day !== '' && day > new Date().toISOString().slice(0, 10) ? { ahead: true } : null;
}

type PaymentForm = FormGroup<{
  kind: FormControl<'deposit' | 'balance'>;
  amount: FormControl<string>;
  method: FormControl<'cash' | 'bank_transfer'>;
  receivedOn: FormControl<string>;
  reference: FormControl<string>;
}>;

/**
 * The owner's form for money received outside the card checkout: deposit or
 * balance, the amount in pounds, cash or bank transfer, the day it arrived and
 * a reference. It suggests the amount due for the kind chosen; the server
 * refuses a kind already paid, and its messages show under their fields.
 */
@Component({
  selector: 'ks-record-payment-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldError],
  template: `
    <form [formGroup]="form" (ngSubmit)="recordPayment()" class="record-payment" aria-labelledby="record-payment-heading">
      <h4 id="record-payment-heading">Record a cash or bank-transfer payment</h4>
      <mat-form-field>
        <mat-label>Payment</mat-label>
        <mat-select formControlName="kind" (selectionChange)="suggestAmount()">
          <mat-option value="deposit">Deposit</mat-option>
          <mat-option value="balance">Balance</mat-option>
        </mat-select>
        <mat-error [ksErrorOf]="form.controls.kind" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>Amount received (£)</mat-label>
        <input matInput formControlName="amount" inputmode="decimal" autocomplete="off" />
        <mat-error [ksErrorOf]="form.controls.amount" required="Enter the amount received" [messages]="amountMessages" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>How it was paid</mat-label>
        <mat-select formControlName="method">
          <mat-option value="cash">Cash</mat-option>
          <mat-option value="bank_transfer">Bank transfer</mat-option>
        </mat-select>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Date received</mat-label>
        <input matInput type="date" formControlName="receivedOn" />
        <mat-error [ksErrorOf]="form.controls.receivedOn" required="Enter the day the money arrived" [messages]="{ ahead: 'The day cannot be in the future' }" />
      </mat-form-field>
      <mat-form-field class="reference">
        <mat-label>Reference</mat-label>
        <input matInput formControlName="reference" [maxlength]="limits.reference" autocomplete="off" />
        <mat-hint>The bank reference, or where the cash was handed over</mat-hint>
        <mat-error [ksErrorOf]="form.controls.reference" required="Enter a reference" />
      </mat-form-field>
      @if (error(); as e) {
        <p class="error" role="alert">{{ e }}</p>
      }
      <p class="actions">
        <button mat-flat-button type="submit" [disabled]="saving()">Record payment</button>
        <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
      </p>
    </form>
  `,
  styles: `
    .record-payment { display: flex; flex-wrap: wrap; gap: 0 12px; align-items: flex-start; }
    h4, .actions, .error { flex-basis: 100%; margin: 4px 0; }
    .reference { flex: 1 1 280px; }
    .error { color: var(--mat-sys-error); }
  `,
})
export class RecordPaymentForm {
  private readonly api = inject(QuotesApi);
  readonly commissionId = input.required<number>();
  /** What is due now, to suggest the amount for the kind chosen. */
  readonly due = input<{ depositPence: number; balancePence: number; depositPaid: boolean } | null>(null);
  readonly recorded = output<Payment>();
  readonly cancelled = output<void>();

  protected readonly limits = PAYMENT_TEXT_LIMITS;
  protected readonly amountMessages = { pounds: 'Enter pounds and pence, such as 126.45', positive: 'The amount must be more than £0.00' };
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly form: PaymentForm = inject(NonNullableFormBuilder).group({
    kind: this.nonNull<'deposit' | 'balance'>('deposit'),
    amount: ['', [Validators.required, pounds]],
    method: this.nonNull<'cash' | 'bank_transfer'>('cash'),
    receivedOn: [new Date().toISOString().slice(0, 10), [Validators.required, notAhead]],
    reference: ['', [Validators.required, Validators.maxLength(PAYMENT_TEXT_LIMITS.reference), Validators.pattern(/\S/)]],
  });

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
  }

  private nonNull<T>(value: T): FormControl<T> {
    return new FormControl(value, { nonNullable: true });
  }

  /** Fills in the amount due for the kind, unless the owner has typed one. */
  suggestAmount(): void {
    const due = this.due();
    if (!due || this.form.controls.amount.dirty) return;
    const pence = this.form.controls.kind.value === 'deposit' ? due.depositPence : due.balancePence;
    this.form.controls.amount.setValue(formatPounds(pence).replace(/[£,]/g, ''));
  }

  ngOnInit(): void {
    const due = this.due();
    if (due?.depositPaid) this.form.controls.kind.setValue('balance');
    this.suggestAmount();
  }

  protected recordPayment(): void {
    this.error.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const payment: ManualPayment = { kind: v.kind, amountPence: parsePounds(v.amount)!, method: v.method, receivedOn: v.receivedOn, reference: v.reference.trim() };
    this.saving.set(true);
    this.api.recordPayment(this.commissionId(), payment).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.form.markAsPristine();
        this.recorded.emit(saved);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = { ...apiErrorOf(error)?.fields };
        if (fields['amountPence']) {
          fields['amount'] = fields['amountPence'];
          delete fields['amountPence'];
        }
        applyServerFieldErrors(this.form, fields);
        this.error.set(messageFor(error));
      },
    });
  }
}
