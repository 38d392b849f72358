import { ChangeDetectionStrategy, Component, inject, input, linkedSignal, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, FormGroupDirective, NgForm, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { GRAIN, Grain, Length, LengthUnit, formatInches } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { applyServerFieldErrors } from '../shared/server-field-errors';
import { lengthText, readingText, showMillimetres } from '../shared/length-text';
import { Panel, PanelDraft } from './commission';
import { CommissionsApi } from './commissions-api';

/** Shows a measurement's problem while it is typed, not only after leaving the field. */
class WhileTyping implements ErrorStateMatcher {
  isErrorState(control: FormControl | null, form: FormGroupDirective | NgForm | null): boolean {
    return !!control?.invalid && (control.dirty || control.touched || !!form?.submitted);
  }
}

type PanelForm = FormGroup<{
  name: FormControl<string>;
  width: FormControl<string>;
  height: FormControl<string>;
  grain: FormControl<Grain>;
}>;

interface PanelRow {
  key: number;
  form: PanelForm;
  saved: Panel | null;
  saving: boolean;
  error: string | null;
}

/**
 * The usable flat pieces measured off one garment after unpicking. Each row is
 * saved on its own; lengths go to the server as typed, with the chosen unit.
 */
@Component({
  selector: 'ks-panels-editor',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './panels-editor.html',
  styleUrl: './panels-editor.scss',
  providers: [{ provide: ErrorStateMatcher, useClass: WhileTyping }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PanelsEditor {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);
  private nextKey = 1;

  readonly garmentId = input.required<number>();
  readonly panels = input<readonly Panel[]>([]);

  protected readonly grains = GRAIN.values.map((value) => ({ value, label: GRAIN.labels[value] }));
  protected readonly units: readonly { value: LengthUnit; label: string }[] = [
    { value: 'in', label: 'inches' },
    { value: 'cm', label: 'centimetres' },
    { value: 'mm', label: 'millimetres' },
  ];
  protected readonly unit = new FormControl<LengthUnit>('in', { nonNullable: true });
  private readonly unitValue = toSignal(this.unit.valueChanges, { initialValue: this.unit.value });

  protected readonly rows = linkedSignal<readonly Panel[], PanelRow[]>({
    source: this.panels,
    computation: (panels) => panels.map((panel) => this.rowFor(panel)),
  });
  protected readonly status = signal('');

  constructor() {
    // A new unit changes how every unsaved measurement reads.
    this.unit.valueChanges.subscribe(() => {
      for (const row of this.rows()) {
        row.form.controls.width.updateValueAndValidity();
        row.form.controls.height.updateValueAndValidity();
      }
    });
  }

  private rowFor(panel: Panel | null): PanelRow {
    const unit = () => this.unit.value;
    const asTyped = (mm: string) => formatInches(Length.millimetres(mm), 'nearest', ' in');
    const form: PanelForm = new FormGroup({
      name: new FormControl(panel?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(60)] }),
      width: new FormControl(panel ? asTyped(panel.widthMm) : '', { nonNullable: true, validators: [lengthText(unit, true)] }),
      height: new FormControl(panel ? asTyped(panel.heightMm) : '', { nonNullable: true, validators: [lengthText(unit, true)] }),
      grain: new FormControl<Grain>(panel?.grain ?? 'vertical', { nonNullable: true }),
    });
    return { key: this.nextKey++, form, saved: panel, saving: false, error: null };
  }

  /** What the typed text reads as, in inches and centimetres. */
  protected reading(text: string) {
    return readingText(text, this.unitValue());
  }

  protected savedSize(row: PanelRow): string {
    return row.saved ? `${showMillimetres(row.saved.widthMm)} × ${showMillimetres(row.saved.heightMm)}` : '';
  }

  protected addPanel(): void {
    this.rows.update((rows) => [...rows, this.rowFor(null)]);
    this.status.set('A new panel row was added at the end.');
  }

  private patchRow(key: number, changes: Partial<PanelRow>): void {
    this.rows.update((rows) => rows.map((r) => (r.key === key ? { ...r, ...changes } : r)));
  }

  protected savePanel(row: PanelRow): void {
    const form = row.form;
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    const value = form.getRawValue();
    const unit = this.unit.value;
    const request = row.saved
      ? this.api.updatePanel(row.saved.id, this.changesOf(form, unit))
      : this.api.addPanel(this.garmentId(), { name: value.name.trim(), width: value.width, height: value.height, unit, grain: value.grain });
    this.patchRow(row.key, { saving: true, error: null });
    request.subscribe({
      next: (panel) => {
        form.markAsPristine();
        this.patchRow(row.key, { saving: false, saved: panel });
        this.status.set(`Panel “${panel.name}” saved.`);
      },
      error: (error: unknown) => {
        const unmatched = applyServerFieldErrors(form, apiErrorOf(error)?.fields);
        const fieldsShown = unmatched.length === 0 && !!apiErrorOf(error)?.fields;
        this.patchRow(row.key, { saving: false, error: fieldsShown ? null : messageFor(error) });
      },
    });
  }

  /** Only what was changed goes in an edit, so an untouched length is not re-rounded. */
  private changesOf(form: PanelForm, unit: LengthUnit): Partial<PanelDraft> {
    const c = form.controls;
    const changes: Partial<PanelDraft> = {};
    if (c.name.dirty) changes.name = c.name.value.trim();
    if (c.grain.dirty) changes.grain = c.grain.value;
    if (c.width.dirty) changes.width = c.width.value;
    if (c.height.dirty) changes.height = c.height.value;
    if (c.width.dirty || c.height.dirty) changes.unit = unit;
    return changes;
  }

  protected deletePanel(row: PanelRow): void {
    if (!row.saved) {
      this.rows.update((rows) => rows.filter((r) => r.key !== row.key));
      this.status.set('The unsaved panel row was removed.');
      return;
    }
    const name = row.saved.name;
    this.patchRow(row.key, { saving: true, error: null });
    this.api.deletePanel(row.saved.id).subscribe({
      next: () => {
        this.rows.update((rows) => rows.filter((r) => r.key !== row.key));
        this.notices.info(`Panel “${name}” deleted.`);
      },
      error: () => this.patchRow(row.key, { saving: false }),
    });
  }
}
