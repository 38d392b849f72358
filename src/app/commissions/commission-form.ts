import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { AGE_GROUP, AgeGroup, COMMISSION_KIND, CommissionKind, cautionsFor } from '@keepstitch/shared';
import { catchError, map, of } from 'rxjs';

import { ClientsApi } from '../clients/clients-api';
import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { lengthText, readingText } from '../shared/length-text';
import { applyServerFieldErrors } from '../shared/server-field-errors';
import { CommissionDraft, orNull } from './commission';
import { CommissionsApi } from './commissions-api';

const POUNDS = /^\d{1,7}(\.\d{1,2})?$/;

/** Whole pence from a pounds amount typed as "450" or "450.50", without floating-point drift. */
export function toPence(pounds: string): number {
  const [whole, fraction = ''] = pounds.trim().split('.');
  return Number(whole) * 100 + Number((fraction + '00').slice(0, 2));
}

/** Opens a new commission for a client (owner only). */
@Component({
  selector: 'ks-commission-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatCardModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  templateUrl: './commission-form.html',
  styleUrl: './commission-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommissionForm {
  private readonly api = inject(CommissionsApi);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);

  protected readonly kinds = COMMISSION_KIND.values.map((value) => ({ value, label: COMMISSION_KIND.labels[value] }));
  protected readonly ages = AGE_GROUP.values.map((value) => ({ value, label: AGE_GROUP.labels[value] }));
  protected readonly clients = toSignal(
    inject(ClientsApi)
      .list({ page: 0, pageSize: 100, sort: 'name', dir: 'asc' })
      .pipe(
        map((page) => page.items),
        catchError(() => of(null)),
      ),
  );

  private readonly unitOf = () => this.form.controls.unit.value;
  protected readonly form = new FormGroup({
    clientId: new FormControl<number | null>(null, [Validators.required]),
    title: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    kind: new FormControl<CommissionKind>('memory_quilt', { nonNullable: true }),
    recipient: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(120)] }),
    ageGroup: new FormControl<AgeGroup>('adult', { nonNullable: true }),
    occasion: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(120)] }),
    width: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf)] }),
    length: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf)] }),
    unit: new FormControl<'in' | 'cm'>('in', { nonNullable: true }),
    deadline: new FormControl('', { nonNullable: true }),
    budget: new FormControl('', { nonNullable: true, validators: [Validators.pattern(POUNDS)] }),
    notes: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(4000)] }),
  });

  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly cautions = computed(() => cautionsFor(this.value().ageGroup ?? 'adult'));
  protected readonly widthReading = computed(() => readingText(this.value().width ?? '', this.value().unit ?? 'in'));
  protected readonly lengthReading = computed(() => readingText(this.value().length ?? '', this.value().unit ?? 'in'));
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);

  constructor() {
    this.form.controls.unit.valueChanges.subscribe(() => {
      this.form.controls.width.updateValueAndValidity();
      this.form.controls.length.updateValueAndValidity();
    });
  }

  protected saveCommission(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const draft: CommissionDraft = {
      clientId: v.clientId!,
      title: v.title.trim(),
      kind: v.kind,
      recipient: orNull(v.recipient),
      ageGroup: v.ageGroup,
      occasion: orNull(v.occasion),
      deadline: v.deadline || null,
      budgetPence: v.budget.trim() ? toPence(v.budget) : null,
      notes: orNull(v.notes),
    };
    if (v.width.trim()) draft.width = v.width.trim();
    if (v.length.trim()) draft.length = v.length.trim();
    if (draft.width || draft.length) draft.unit = v.unit;

    this.saving.set(true);
    this.api.create(draft).subscribe({
      next: (commission) => {
        this.notices.info(`Commission “${commission.title}” opened.`);
        void this.router.navigate(['/commissions', commission.id]);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = { ...apiErrorOf(error)?.fields };
        if (fields['budgetPence']) {
          fields['budget'] = fields['budgetPence'];
          delete fields['budgetPence'];
        }
        const unmatched = applyServerFieldErrors(this.form, fields);
        this.formError.set(unmatched.length || !apiErrorOf(error)?.fields ? [messageFor(error), ...unmatched].join(' ') : null);
      },
    });
  }
}
