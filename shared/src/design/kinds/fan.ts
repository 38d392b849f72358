// A fan: a quarter ring of blades in a corner of the background square, round a quarter circle.

import { defineBlockKind } from './block-kind';
import { wedgeCuts, wedgeInputs, wedgeSewing, wedgeShapes, wedgeTemplates } from './wedge-kinds';

const BLADES = 5;

export const fan = defineBlockKind({
  kind: 'fan',
  label: 'Fan',
  roles: ['blades', 'corner', 'background'],
  inputs: wedgeInputs(BLADES),
  labour: { label: 'Fan', minutes: 45 },
  cuts: (spec, side, opts) => wedgeCuts('fan', BLADES, spec, side, opts),
  sewing: (_spec, blocks, cuts) => wedgeSewing('fan', blocks, cuts),
  templates: (spec, cuts) => wedgeTemplates('fan', spec, cuts),
  shapes: (spec, p, add) => wedgeShapes('fan', BLADES, spec, p, add),
});
