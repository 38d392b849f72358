import { ChangeDetectionStrategy, Component, OnInit, inject, input, output, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  COLOUR_RUN,
  CONSTRUCTION,
  ColourRun,
  Construction,
  FIBRE,
  GARMENT_TEXT_LIMITS,
  Fibre,
  PREWASH,
  PRINT,
  Prewash,
  Print,
} from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { keepUnsavedWork } from '../core/unsaved-work';
import { applyServerFieldErrors } from '../shared/server-field-errors';
import { GarmentDetail, GarmentDraft, orNull } from './commission';
import { CommissionsApi } from './commissions-api';
import { KeptFeatureForm, keptFeatureForm } from './kept-feature-form';
import { KeptFeaturesEditor } from './kept-features-editor';

const TEXT_FIELDS = ['description', 'whose', 'story', 'colour', 'condition', 'returnsToClient'] as const;
const CHOICE_FIELDS = ['fibre', 'construction', 'print', 'prewash', 'colourRun'] as const;

/**
 * Changes what the studio knows about a garment. Only changed fields are sent.
 * A choice the garment has no value for yet may stay unset; once set, the
 * server keeps it set, so "not known" is offered only while it is not known.
 */
@Component({
  selector: 'ks-garment-details-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, KeptFeaturesEditor],
  templateUrl: './garment-details-form.html',
  styleUrl: './garment-details-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GarmentDetailsForm implements OnInit {
  private readonly api = inject(CommissionsApi);

  readonly garment = input.required<GarmentDetail>();
  /** The garment as the server has it after the change. */
  readonly saved = output<GarmentDetail>();
  readonly cancelled = output<void>();

  protected readonly fibres = FIBRE.options;
  protected readonly constructions = CONSTRUCTION.options;
  protected readonly prints = PRINT.options;
  protected readonly prewashes = PREWASH.options;
  protected readonly colourRuns = COLOUR_RUN.options;
  protected readonly limits = GARMENT_TEXT_LIMITS;

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
  }

  protected readonly form = new FormGroup({
    description: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(GARMENT_TEXT_LIMITS.description)] }),
    whose: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.whose)] }),
    story: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.story)] }),
    fibre: new FormControl<Fibre | null>(null),
    construction: new FormControl<Construction | null>(null),
    colour: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.colour)] }),
    print: new FormControl<Print | null>(null),
    condition: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.condition)] }),
    features: new FormArray<KeptFeatureForm>([]),
    prewash: new FormControl<Prewash | null>(null),
    colourRun: new FormControl<ColourRun | null>(null),
    returnsToClient: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.returnsToClient)] }),
  });

  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  ngOnInit(): void {
    const g = this.garment();
    this.form.reset({
      description: g.description,
      whose: g.whose ?? '',
      story: g.story ?? '',
      fibre: g.fibre ?? null,
      construction: g.construction ?? null,
      colour: g.colour ?? '',
      print: g.print ?? null,
      condition: g.condition ?? '',
      prewash: g.prewash ?? null,
      colourRun: g.colourRun ?? null,
      returnsToClient: g.returnsToClient ?? '',
    });
    for (const f of g.features ?? []) this.form.controls.features.push(keptFeatureForm(f));
  }

  /** True when the garment came without this choice, so leaving it unset is allowed. */
  protected unset(field: (typeof CHOICE_FIELDS)[number]): boolean {
    const value = this.garment()[field];
    return value === null || value === undefined;
  }

  protected saveGarment(): void {
    this.error.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const g = this.garment();
    const v = this.form.getRawValue();
    const changes: Partial<GarmentDraft> = {};
    for (const key of TEXT_FIELDS) {
      const now = key === 'description' ? v.description.trim() : orNull(v[key]);
      const before = key === 'description' ? g.description : orNull(g[key]);
      if (now !== before) (changes as Record<string, unknown>)[key] = now;
    }
    for (const key of CHOICE_FIELDS) {
      const now = v[key];
      if (now !== null && now !== (g[key] ?? null)) (changes as Record<string, unknown>)[key] = now;
    }
    const features = v.features.map((f) => ({ kind: f.kind, position: f.position.trim() }));
    const featuresBefore = (g.features ?? []).map((f) => ({ kind: f.kind, position: f.position }));
    if (JSON.stringify(features) !== JSON.stringify(featuresBefore)) changes.features = features;

    if (Object.keys(changes).length === 0) {
      this.error.set('Nothing has changed yet.');
      return;
    }
    this.saving.set(true);
    this.api.updateGarment(g.id, changes).subscribe({
      next: (garment) => {
        this.saving.set(false);
        this.form.markAsPristine();
        this.saved.emit(garment);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = apiErrorOf(error)?.fields;
        const unmatched = applyServerFieldErrors(this.form, fields);
        this.error.set(!fields || unmatched.length ? [messageFor(error), ...unmatched].join(' ') : null);
      },
    });
  }
}
