// A plate: a full ring of blades round a centre circle, on a background square.

import { defineBlockKind } from './block-kind';
import { wedgeCuts, wedgeInputs, wedgeSewing, wedgeShapes, wedgeTemplates } from './wedge-kinds';

const BLADES = 20;

export const plate = defineBlockKind({
  kind: 'plate',
  label: 'Plate',
  roles: ['blades', 'centre', 'background'],
  inputs: wedgeInputs(BLADES, { outer: 'block − 1 in', inner: '2' }),
  labour: { label: 'Plate', minutes: 90 },
  cuts: (spec, side, opts) => wedgeCuts('plate', BLADES, spec, side, opts),
  sewing: (_spec, blocks, cuts) => wedgeSewing('plate', blocks, cuts),
  templates: (spec, cuts) => wedgeTemplates('plate', spec, cuts),
  shapes: (spec, p, add) => wedgeShapes('plate', BLADES, spec, p, add),
});
