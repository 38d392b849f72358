import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
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
import { AGE_GROUP, AgeGroup, COMMISSION_KIND, COMMISSION_TEXT_LIMITS, CommissionKind, cautionsFor } from '@keepstitch/shared';
import { catchError, map, of } from 'rxjs';

import { ClientRow } from '../clients/client';
import { ClientsApi } from '../clients/clients-api';
import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { DATE_FIELD, DateFieldWords, provideDateField } from '../ui/date-field';
import { lengthText, readingText, typedLength, unitForMillimetres } from '../ui/length-text';
import { Loader } from '../ui/loader';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { Commission, CommissionChanges, CommissionDraft, orNull } from './commission';
import { CommissionsApi } from './commissions-api';

const POUNDS = /^\d{1,7}(\.\d{1,2})?$/;

/** Whole pence from a pounds amount typed as "450" or "450.50", without floating-point drift. */
export function toPence(pounds: string): number {
  const [whole, fraction = ''] = pounds.trim().split('.');
  return Number(whole) * 100 + Number((fraction + '00').slice(0, 2));
}

/**
 * Opens a new commission for a client, or, at `/commissions/:id/edit`, changes
 * one (owner only). An edit sends only the fields that changed; the client stays.
 */
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
    DATE_FIELD,
  ],
  providers: [provideDateField()],
  templateUrl: './commission-form.html',
  styleUrl: './commission-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommissionForm {
  private readonly api = inject(CommissionsApi);
  private readonly clientsApi = inject(ClientsApi);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  protected readonly dates = inject(DateFieldWords);

  /** From the route when editing, `/commissions/:id/edit`; absent for a new commission. */
  readonly id = input<string>();
  /** From the query string of a new commission (`?client=12`, as the client's page links it): that client is chosen. */
  readonly client = input<string>();

  protected readonly kinds = COMMISSION_KIND.options;
  protected readonly ages = AGE_GROUP.options;
  /** Undefined while loading, null when they could not be loaded. */
  protected readonly clients = signal<ClientRow[] | null | undefined>(undefined);
  /** The commission being changed, as the server last sent it. */
  protected readonly original = signal<Commission | null>(null);
  /** The commission being edited (none for a new one, which loads the clients to choose from instead). */
  private readonly editing = new Loader(
    () => {
      const id = this.id();
      return id === undefined ? of(null) : this.api.get(Number(id));
    },
    { loaded: (c) => (c ? this.prefill(c) : this.loadClients()) },
  );
  protected readonly editLoad = this.editing.state;
  protected readonly isEdit = computed(() => this.id() !== undefined);
  protected readonly backLink = computed(() => (this.isEdit() ? ['/commissions', this.id()] : ['/commissions']));

  private readonly unitOf = () => this.form.controls.unit.value;
  /** The server's limit on notes; the field stops taking text there, as the shorter fields do at theirs. */
  protected readonly notesLimit = COMMISSION_TEXT_LIMITS.notes;
  protected readonly limits = COMMISSION_TEXT_LIMITS;
  protected readonly form = new FormGroup({
    clientId: new FormControl<number | null>(null, [Validators.required]),
    title: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(COMMISSION_TEXT_LIMITS.title)] }),
    kind: new FormControl<CommissionKind>('memory_quilt', { nonNullable: true }),
    recipient: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.recipient)] }),
    ageGroup: new FormControl<AgeGroup>('adult', { nonNullable: true }),
    occasion: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.occasion)] }),
    sizePreset: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.sizePreset)] }),
    width: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf)] }),
    length: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf)] }),
    unit: new FormControl<'in' | 'cm'>('in', { nonNullable: true }),
    deadline: new FormControl<string | null>(''),
    budget: new FormControl('', { nonNullable: true, validators: [Validators.pattern(POUNDS)] }),
    notes: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.notes)] }),
  });

  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly cautions = computed(() => cautionsFor(this.value().ageGroup ?? 'adult'));
  protected readonly widthReading = computed(() => readingText(this.value().width ?? '', this.value().unit ?? 'in'));
  protected readonly lengthReading = computed(() => readingText(this.value().length ?? '', this.value().unit ?? 'in'));
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  /** The form as first filled in for an edit, to tell what changed. */
  private prefilled: ReturnType<typeof sentValues> | null = null;

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
    this.form.controls.unit.valueChanges.subscribe(() => {
      this.form.controls.width.updateValueAndValidity();
      this.form.controls.length.updateValueAndValidity();
    });
  }

  private loadClients(): void {
    this.clientsApi
      .list({ page: 0, pageSize: 100, sort: 'name', dir: 'asc' })
      .pipe(
        map((page) => page.items),
        catchError(() => of(null)),
      )
      .subscribe((items) => {
        this.clients.set(items);
        const chosen = Number(this.client());
        if (items?.some((c) => c.id === chosen) && this.form.controls.clientId.value === null) this.form.controls.clientId.setValue(chosen);
      });
  }

  protected loadCommission(): void {
    this.editing.reload();
  }

  /** Fills the form from the commission, sizes written back as lengths in the unit they read best in. */
  private prefill(c: Commission): void {
    const unit = unitForMillimetres([c.widthMm, c.lengthMm]);
    this.original.set(c);
    this.form.controls.clientId.disable();
    this.form.reset({
      clientId: c.clientId,
      title: c.title,
      kind: c.kind,
      recipient: c.recipient ?? '',
      ageGroup: c.ageGroup,
      occasion: c.occasion ?? '',
      sizePreset: c.sizePreset ?? '',
      width: typedLength(c.widthMm, unit),
      length: typedLength(c.lengthMm, unit),
      unit,
      deadline: c.deadline ?? '',
      budget: c.budgetPence === null || c.budgetPence === undefined ? '' : toPounds(c.budgetPence),
      notes: c.notes ?? '',
    });
    this.prefilled = this.readForm();
  }

  private readForm() {
    return sentValues(this.form.getRawValue());
  }


  protected saveCommission(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const original = this.original();
    if (this.isEdit()) {
      if (original) this.saveChanges(original);
      return;
    }
    const v = this.readForm();
    const draft: CommissionDraft = {
      clientId: this.form.controls.clientId.value!,
      title: v.title,
      kind: v.kind,
      recipient: v.recipient,
      ageGroup: v.ageGroup,
      occasion: v.occasion,
      deadline: v.deadline,
      budgetPence: v.budgetPence,
      notes: v.notes,
    };
    if (v.sizePreset) draft.sizePreset = v.sizePreset;
    if (v.width) draft.width = v.width;
    if (v.length) draft.length = v.length;
    if (draft.width || draft.length) draft.unit = v.unit;

    this.saving.set(true);
    this.api.create(draft).subscribe({
      next: (commission) => {
        this.notices.info(`Commission “${commission.title}” opened.`);
        this.form.markAsPristine();
        void this.router.navigate(['/commissions', commission.id]);
      },
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  /** Sends only what differs from the prefilled form; a changed unit re-sends both lengths. */
  private saveChanges(original: Commission): void {
    const before = this.prefilled!;
    const now = this.readForm();
    const changes: CommissionChanges = {};
    for (const key of ['title', 'kind', 'recipient', 'ageGroup', 'occasion', 'sizePreset', 'deadline', 'budgetPence', 'notes'] as const) {
      if (now[key] !== before[key]) (changes as Record<string, unknown>)[key] = now[key];
    }
    const unitChanged = now.unit !== before.unit;
    if (unitChanged || now.width !== before.width) changes.width = now.width;
    if (unitChanged || now.length !== before.length) changes.length = now.length;
    if (changes.width !== undefined || changes.length !== undefined) changes.unit = now.unit;
    if (Object.keys(changes).length === 0) {
      this.formError.set('Nothing has changed yet.');
      return;
    }
    this.saving.set(true);
    this.api.update(original.id, changes).subscribe({
      next: (commission) => {
        this.notices.info(`Changes to “${commission.title}” saved.`);
        this.form.markAsPristine();
        void this.router.navigate(['/commissions', commission.id]);
      },
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private showRefusal(error: unknown): void {
    this.saving.set(false);
    const fields = { ...apiErrorOf(error)?.fields };
    if (fields['budgetPence']) {
      fields['budget'] = fields['budgetPence'];
      delete fields['budgetPence'];
    }
    const unmatched = applyServerFieldErrors(this.form, fields);
    this.formError.set(unmatched.length || !apiErrorOf(error)?.fields ? [messageFor(error), ...unmatched].join(' ') : null);
  }
}

/** The form's values as they would be sent: trimmed, empty text as null, pounds as pence. */
function sentValues(v: {
  title: string; kind: CommissionKind; recipient: string; ageGroup: AgeGroup; occasion: string; sizePreset: string;
  width: string; length: string; unit: 'in' | 'cm'; deadline: string | null; budget: string; notes: string;
}) {
  return {
    title: v.title.trim(),
    kind: v.kind,
    recipient: orNull(v.recipient),
    ageGroup: v.ageGroup,
    occasion: orNull(v.occasion),
    sizePreset: orNull(v.sizePreset),
    width: orNull(v.width),
    length: orNull(v.length),
    unit: v.unit,
    deadline: v.deadline || null,
    budgetPence: v.budget.trim() ? toPence(v.budget) : null,
    notes: orNull(v.notes),
  };
}

/** Pence shown back as pounds the way a person types them: "450" or "450.50". */
export function toPounds(pence: number): string {
  const pounds = Math.floor(pence / 100);
  const rest = pence % 100;
  return rest === 0 ? `${pounds}` : `${pounds}.${String(rest).padStart(2, '0')}`;
}
