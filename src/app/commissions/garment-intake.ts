import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatStepperModule } from '@angular/material/stepper';
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
import { PhotoUpload } from '../shared/photo-upload';
import { applyServerFieldErrors } from '../shared/server-field-errors';
import { GarmentDetail, GarmentDraft, orNull } from './commission';
import { CommissionsApi } from './commissions-api';
import { KeptFeatureForm } from './kept-feature-form';
import { KeptFeaturesEditor } from './kept-features-editor';

/**
 * Logging a garment in four short steps: what it is, fibre and care, the
 * features to keep, and photos. The garment is saved first, then its photos.
 */
@Component({
  selector: 'ks-garment-intake',
  imports: [
    KeptFeaturesEditor,
    ReactiveFormsModule,
    MatStepperModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    PhotoUpload,
  ],
  templateUrl: './garment-intake.html',
  styleUrl: './garment-intake.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GarmentIntake {
  private readonly api = inject(CommissionsApi);

  readonly commissionId = input.required<number>();
  readonly added = output<GarmentDetail>();
  readonly closed = output<void>();

  protected readonly fibres = FIBRE.options;
  protected readonly constructions = CONSTRUCTION.options;
  protected readonly prints = PRINT.options;
  protected readonly prewashes = PREWASH.options;
  protected readonly colourRuns = COLOUR_RUN.options;
  protected readonly limits = GARMENT_TEXT_LIMITS;

  protected readonly what = new FormGroup({
    description: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(GARMENT_TEXT_LIMITS.description)] }),
    whose: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.whose)] }),
    story: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.story)] }),
    colour: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.colour)] }),
    print: new FormControl<Print | null>(null),
  });
  protected readonly care = new FormGroup({
    fibre: new FormControl<Fibre | null>(null),
    construction: new FormControl<Construction | null>(null),
    condition: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.condition)] }),
    prewash: new FormControl<Prewash | null>(null),
    colourRun: new FormControl<ColourRun | null>(null),
    returnsToClient: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.returnsToClient)] }),
  });
  protected readonly features = new FormArray<KeptFeatureForm>([]);

  protected readonly saving = signal(false);
  protected readonly saved = signal<GarmentDetail | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly photoUrl = computed(() => {
    const garment = this.saved();
    return garment ? `/api/garments/${garment.id}/photos` : null;
  });
  protected readonly isKnit = signal(false);

  constructor() {
    keepUnsavedWork(() => !this.saved() && (this.what.dirty || this.care.dirty || this.features.dirty));
    this.care.controls.construction.valueChanges.subscribe((c) => this.isKnit.set(c === 'knit'));
  }

  protected saveGarment(): void {
    if (this.saved()) return;
    if (this.what.invalid || this.features.invalid) {
      this.what.markAllAsTouched();
      this.features.markAllAsTouched();
      this.error.set('Check the earlier steps: a description is needed, and every kept feature needs its place.');
      return;
    }
    const w = this.what.getRawValue();
    const c = this.care.getRawValue();
    const draft: GarmentDraft = {
      description: w.description.trim(),
      whose: orNull(w.whose),
      story: orNull(w.story),
      colour: orNull(w.colour),
      print: w.print,
      fibre: c.fibre,
      construction: c.construction,
      condition: orNull(c.condition),
      prewash: c.prewash,
      colourRun: c.colourRun,
      returnsToClient: orNull(c.returnsToClient),
      features: this.features.getRawValue().map((f) => ({ kind: f.kind, position: f.position.trim() })),
    };
    this.saving.set(true);
    this.error.set(null);
    this.api.addGarment(this.commissionId(), draft).subscribe({
      next: (garment) => {
        this.saving.set(false);
        this.saved.set(garment);
        this.added.emit(garment);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        applyServerFieldErrors(this.what, apiErrorOf(error)?.fields);
        applyServerFieldErrors(this.care, apiErrorOf(error)?.fields);
        this.error.set(messageFor(error));
      },
    });
  }
}
