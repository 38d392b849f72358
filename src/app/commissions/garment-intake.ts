import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormArray, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatStepperModule } from '@angular/material/stepper';
import { keepUnsavedWork } from '../core/unsaved-work';
import { FieldError } from '../ui/field-error';
import { PhotoUpload } from '../ui/photo-upload';
import { GarmentDetail } from './commission';
import { CommissionsApi } from './commissions-api';
import { GARMENT_CHOICES, GarmentSave, garmentControls, garmentDraft, keptFeaturesFrom } from './garment-form';
import { KeptFeatureForm } from './kept-feature-form';
import { KeptFeaturesEditor } from './kept-features-editor';

/**
 * Logging a garment in four short steps: what it is, fibre and care, the
 * features to keep, and photos. The garment is saved first, then its photos.
 */
@Component({
  selector: 'ks-garment-intake',
  imports: [
    FieldError,
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

  protected readonly choices = GARMENT_CHOICES;

  private readonly controls = garmentControls();
  protected readonly what = new FormGroup({
    description: this.controls.description,
    whose: this.controls.whose,
    story: this.controls.story,
    colour: this.controls.colour,
    print: this.controls.print,
  });
  protected readonly care = new FormGroup({
    fibre: this.controls.fibre,
    construction: this.controls.construction,
    condition: this.controls.condition,
    prewash: this.controls.prewash,
    colourRun: this.controls.colourRun,
    returnsToClient: this.controls.returnsToClient,
  });
  protected readonly features = new FormArray<KeptFeatureForm>([]);

  private readonly save = new GarmentSave();
  protected readonly saving = this.save.saving;
  protected readonly saved = signal<GarmentDetail | null>(null);
  protected readonly error = this.save.error;
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
    const draft = garmentDraft({ ...this.what.getRawValue(), ...this.care.getRawValue() }, keptFeaturesFrom(this.features));
    this.save.send(this.api.addGarment(this.commissionId(), draft), [this.what, this.care], (garment) => {
      this.saved.set(garment);
      this.added.emit(garment);
    });
  }
}
