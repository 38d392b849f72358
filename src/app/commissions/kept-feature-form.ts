import { FormControl, FormGroup, Validators } from '@angular/forms';
import { FeatureKind, KEPT_FEATURE_LIMITS } from '@keepstitch/shared';

import { Feature } from './commission';

/** One kept feature of a garment as a form: what it is, and where on the garment. */
export type KeptFeatureForm = FormGroup<{ kind: FormControl<FeatureKind>; position: FormControl<string> }>;

/** The longest position the server keeps, for the forms' hint and error. */
export const POSITION_LIMIT = KEPT_FEATURE_LIMITS.position;

/** A kept feature's form, as intake and the details form both build it: a place is needed, within the server's limit. */
export function keptFeatureForm(feature: Feature = { kind: 'pocket', position: '' }): KeptFeatureForm {
  return new FormGroup({
    kind: new FormControl<FeatureKind>(feature.kind, { nonNullable: true }),
    position: new FormControl(feature.position, { nonNullable: true, validators: [Validators.required, Validators.maxLength(POSITION_LIMIT)] }),
  });
}
