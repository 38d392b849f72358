import { ChangeDetectionStrategy, Component, inject, input, linkedSignal, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, FormGroupDirective, NgForm, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { GRAIN, Grain, Length, LengthUnit, PANEL_TEXT_LIMITS, formatInches } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { lengthText, readingText, showMillimetres } from '../ui/length-text';
import { Panel, PanelDraft, PanelFeature, PanelFeatureDraft } from './commission';
import { CommissionsApi } from './commissions-api';

/** Shows a measurement's problem while it is typed, not only after leaving the field. */
class WhileTyping implements ErrorStateMatcher {
  isErrorState(control: FormControl | null, form: FormGroupDirective | NgForm | null): boolean {
    return !!control?.invalid && (control.dirty || control.touched || !!form?.submitted);
  }
}

type FeatureForm = FormGroup<{
  name: FormControl<string>;
  x: FormControl<string>;
  y: FormControl<string>;
  width: FormControl<string>;
  height: FormControl<string>;
}>;

type FeatureLength = 'x' | 'y' | 'width' | 'height';

type PanelForm = FormGroup<{
  name: FormControl<string>;
  width: FormControl<string>;
  height: FormControl<string>;
  grain: FormControl<Grain>;
  features: FormArray<FeatureForm>;
}>;

interface PanelRow {
  key: number;
  form: PanelForm;
  saved: Panel | null;
  saving: boolean;
  error: string | null;
}

/**
 * The usable flat pieces measured off one garment after unpicking, each with
 * the kept features (a pocket, a label) measured on it. Each row is saved on
 * its own; lengths go to the server as typed, with the chosen unit.
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

  protected readonly grains = GRAIN.options;
  protected readonly units: readonly { value: LengthUnit; label: string }[] = [
    { value: 'in', label: 'inches' },
    { value: 'cm', label: 'centimetres' },
    { value: 'mm', label: 'millimetres' },
  ];
  protected readonly featureLengths: readonly { key: FeatureLength; label: string; required: string }[] = [
    { key: 'x', label: 'From left', required: 'Enter the distance from the left edge' },
    { key: 'y', label: 'From top', required: 'Enter the distance from the top edge' },
    { key: 'width', label: 'Feature width', required: 'Enter the width' },
    { key: 'height', label: 'Feature height', required: 'Enter the height' },
  ];
  protected readonly unit = new FormControl<LengthUnit>('in', { nonNullable: true });
  /** The stored feature behind each feature form, so an untouched length is sent back exactly. */
  private readonly savedFeatures = new WeakMap<FeatureForm, PanelFeature>();
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
        for (const f of row.form.controls.features.controls) {
          for (const { key } of this.featureLengths) f.controls[key].updateValueAndValidity();
        }
      }
    });
  }

  private rowFor(panel: Panel | null): PanelRow {
    const unit = () => this.unit.value;
    const asTyped = (mm: string) => formatInches(Length.millimetres(mm), 'nearest', ' in');
    const form: PanelForm = new FormGroup({
      name: new FormControl(panel?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(PANEL_TEXT_LIMITS.name)] }),
      width: new FormControl(panel ? asTyped(panel.widthMm) : '', { nonNullable: true, validators: [lengthText(unit, true)] }),
      height: new FormControl(panel ? asTyped(panel.heightMm) : '', { nonNullable: true, validators: [lengthText(unit, true)] }),
      grain: new FormControl<Grain>(panel?.grain ?? 'vertical', { nonNullable: true }),
      features: new FormArray<FeatureForm>((panel?.features ?? []).map((f) => this.featureFor(f))),
    });
    return { key: this.nextKey++, form, saved: panel, saving: false, error: null };
  }

  private featureFor(feature: PanelFeature | null): FeatureForm {
    const unit = () => this.unit.value;
    const asTyped = (mm: string) => formatInches(Length.millimetres(mm), 'nearest', ' in');
    const length = (mm: string | undefined, allowZero: boolean) =>
      new FormControl(mm !== undefined ? asTyped(mm) : '', { nonNullable: true, validators: [lengthText(unit, true, { allowZero })] });
    const form: FeatureForm = new FormGroup({
      name: new FormControl(feature?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(PANEL_TEXT_LIMITS.featureName)] }),
      x: length(feature?.xMm, true),
      y: length(feature?.yMm, true),
      width: length(feature?.widthMm, false),
      height: length(feature?.heightMm, false),
    });
    if (feature) this.savedFeatures.set(form, feature);
    return form;
  }

  /** What the typed text reads as, in inches and centimetres. */
  protected reading(text: string, allowZero = false) {
    return readingText(text, this.unitValue(), { allowZero });
  }

  protected savedSize(row: PanelRow): string {
    return row.saved ? `${showMillimetres(row.saved.widthMm)} × ${showMillimetres(row.saved.heightMm)}` : '';
  }

  /** "breast pocket, 5 in (12.7 cm) × 5 1/2 in (14 cm), 2 in (5.1 cm) from the left, 4 in (10.2 cm) from the top". */
  protected savedFeature(f: PanelFeature): string {
    return `${f.name}, ${showMillimetres(f.widthMm)} × ${showMillimetres(f.heightMm)}, ${showMillimetres(f.xMm)} from the left, ${showMillimetres(f.yMm)} from the top`;
  }

  protected addFeature(row: PanelRow): void {
    const features = row.form.controls.features;
    features.push(this.featureFor(null));
    features.markAsDirty();
    this.status.set(`A kept feature row was added to panel ${row.form.controls.name.value || 'being added'}.`);
  }

  protected removeFeature(row: PanelRow, index: number): void {
    const features = row.form.controls.features;
    const name = features.at(index).controls.name.value;
    features.removeAt(index);
    features.markAsDirty();
    this.status.set(`Kept feature ${name || index + 1} removed; save the panel to keep the change.`);
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
      : this.api.addPanel(this.garmentId(), {
          name: value.name.trim(),
          width: value.width,
          height: value.height,
          unit,
          grain: value.grain,
          ...(value.features.length > 0 ? { features: this.featureDrafts(form) } : {}),
        });
    this.patchRow(row.key, { saving: true, error: null });
    request.subscribe({
      next: (panel) => {
        form.controls.features.controls.forEach((f, i) => {
          const saved = panel.features?.[i];
          if (saved) this.savedFeatures.set(f, saved);
        });
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
    if (c.features.dirty) changes.features = this.featureDrafts(form);
    if (c.width.dirty || c.height.dirty || c.features.dirty) changes.unit = unit;
    return changes;
  }

  /** Every kept feature of the row: typed lengths as typed, untouched stored ones as their exact millimetres. */
  private featureDrafts(form: PanelForm): PanelFeatureDraft[] {
    return form.controls.features.controls.map((f) => {
      const saved = this.savedFeatures.get(f);
      const text = (key: FeatureLength) => {
        const control = f.controls[key];
        if (saved && !control.dirty) return `${saved[`${key}Mm`]}mm`;
        return control.value;
      };
      return { name: f.controls.name.value.trim(), x: text('x'), y: text('y'), width: text('width'), height: text('height') };
    });
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
