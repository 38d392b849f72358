import { FormGroup } from '@angular/forms';

import { GarmentDetail } from './commission';
import { garmentChanges, garmentControls, garmentDraft, garmentFormValues, someGarmentControls } from './garment-form';

const stored: GarmentDetail = {
  id: 7,
  commissionId: 3,
  description: 'Blue work shirt',
  whose: 'Dad',
  story: null,
  fibre: 'cotton',
  construction: 'woven',
  colour: 'Blue',
  print: null,
  features: [{ kind: 'pocket', position: 'left chest' }],
  condition: null,
  prewash: null,
  colourRun: null,
  returnsToClient: 'Collar',
} as GarmentDetail;

describe('garment form', () => {
  it('holds every field with the server’s text limits', () => {
    const form = new FormGroup(garmentControls());
    form.controls.description.setValue('');
    expect(form.controls.description.hasError('required')).toBeTrue();
    form.controls.whose.setValue('x'.repeat(1000));
    expect(form.controls.whose.hasError('maxlength')).toBeTrue();
  });

  it('makes a new garment of only the fields a form has, trimmed, empty text as none', () => {
    const form = new FormGroup(someGarmentControls(['description', 'whose', 'story', 'fibre', 'colour']));
    form.setValue({ description: '  Red scarf ', whose: ' ', story: 'Worn every winter', fibre: 'wool', colour: '' });
    expect(garmentDraft(form.getRawValue())).toEqual({ description: 'Red scarf', whose: null, story: 'Worn every winter', colour: null, fibre: 'wool' });
  });

  it('opened and saved unchanged sends nothing', () => {
    expect(garmentChanges(stored, garmentFormValues(stored), [{ kind: 'pocket', position: 'left chest' }])).toEqual({});
  });

  it('sends only what changed; an unset choice is not sent', () => {
    const values = { ...garmentFormValues(stored), story: 'His Sunday shirt', whose: '', fibre: null };
    expect(garmentChanges(stored, values, [])).toEqual({ story: 'His Sunday shirt', whose: null, features: [] });
  });
});
