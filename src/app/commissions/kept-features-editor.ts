import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { FEATURE } from '@keepstitch/shared';

import { KeptFeatureForm, POSITION_LIMIT, keptFeatureForm } from './kept-feature-form';

/**
 * The rows of a garment's kept features (what it is, where on the garment),
 * with add and remove, over a form array the parent form owns. Used by intake
 * and by the details form, so both ask for the same things in the same words.
 */
@Component({
  selector: 'ks-kept-features-editor',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
  templateUrl: './kept-features-editor.html',
  styleUrl: './kept-features-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeptFeaturesEditor {
  readonly features = input.required<FormArray<KeptFeatureForm>>();
  /** What to say while there are none. */
  readonly emptyText = input('None. Add a pocket, label, embroidery or buttons the client wants kept whole.');

  protected readonly featureKinds = FEATURE.options;
  protected readonly positionLimit = POSITION_LIMIT;

  protected add(): void {
    this.features().push(keptFeatureForm());
  }

  protected remove(index: number): void {
    this.features().removeAt(index);
    this.features().markAsDirty();
  }
}
