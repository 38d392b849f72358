import { KEPT_FEATURE_LIMITS } from '@keepstitch/shared';

import { POSITION_LIMIT, keptFeatureForm } from './kept-feature-form';

describe('keptFeatureForm', () => {
  it('starts as a pocket with no place, which is not yet valid', () => {
    const form = keptFeatureForm();
    expect(form.getRawValue()).toEqual({ kind: 'pocket', position: '' });
    expect(form.controls.position.hasError('required')).toBeTrue();
  });

  it("holds a position up to the server's limit, 200 characters, and no more", () => {
    expect(POSITION_LIMIT).toBe(KEPT_FEATURE_LIMITS.position);
    expect(POSITION_LIMIT).toBe(200);
    const form = keptFeatureForm({ kind: 'label', position: 'x'.repeat(200) });
    expect(form.valid).toBeTrue();
    form.controls.position.setValue('x'.repeat(201));
    expect(form.controls.position.hasError('maxlength')).toBeTrue();
  });
});
