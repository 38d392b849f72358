import { ChangeDetectionStrategy, Component, OnInit, inject, input, output } from '@angular/core';
import { FormArray, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { keepUnsavedWork } from '../core/unsaved-work';
import { FieldError } from '../ui/field-error';
import { GarmentDetail } from './commission';
import { CommissionsApi } from './commissions-api';
import { GARMENT_CHOICES, GARMENT_CHOICE_FIELDS, GarmentSave, garmentChanges, garmentControls, garmentFormValues, keptFeaturesFrom } from './garment-form';
import { KeptFeatureForm, keptFeatureForm } from './kept-feature-form';
import { KeptFeaturesEditor } from './kept-features-editor';

/**
 * Changes what the studio knows about a garment. Only changed fields are sent.
 * A choice the garment has no value for yet may stay unset; once set, the
 * server keeps it set, so "not known" is offered only while it is not known.
 */
@Component({
  selector: 'ks-garment-details-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, KeptFeaturesEditor, FieldError],
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

  protected readonly choices = GARMENT_CHOICES;

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
  }

  protected readonly form = new FormGroup({ ...garmentControls(), features: new FormArray<KeptFeatureForm>([]) });

  private readonly save = new GarmentSave(true);
  protected readonly saving = this.save.saving;
  protected readonly error = this.save.error;

  ngOnInit(): void {
    const g = this.garment();
    this.form.reset(garmentFormValues(g));
    for (const f of g.features ?? []) this.form.controls.features.push(keptFeatureForm(f));
  }

  /** True when the garment came without this choice, so leaving it unset is allowed. */
  protected unset(field: (typeof GARMENT_CHOICE_FIELDS)[number]): boolean {
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
    const { features: _features, ...values } = this.form.getRawValue();
    const changes = garmentChanges(g, values, keptFeaturesFrom(this.form.controls.features));
    if (Object.keys(changes).length === 0) {
      this.error.set('Nothing has changed yet.');
      return;
    }
    this.save.send(this.api.updateGarment(g.id, changes), [this.form], (garment) => {
      this.form.markAsPristine();
      this.saved.emit(garment);
    });
  }
}
