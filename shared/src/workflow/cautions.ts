import type { AgeGroup, KeptFeature } from './vocabulary';

/**
 * The safety notices a commission carries. They are shown as guidance and
 * defer to local codes and licensed practice; the product does not interpret them.
 */
export interface Caution {
  code: 'safe_sleep' | 'small_parts' | 'prewash_required';
  title: string;
  text: string;
  source: string;
}

export const SAFE_SLEEP: Caution = {
  code: 'safe_sleep',
  title: 'Safe sleep for babies under 12 months',
  text:
    'Safe-sleep guidance advises no quilts, duvets, pillows or other soft bedding in a baby\u2019s sleep space until they are one year old. ' +
    'This piece is made for display or supervised play: hang it on a wall or use it as a play mat while the baby is awake and watched.',
  source: 'AAP safe-sleep policy (2022); UK NHS guidance. Follow the advice of your own health visitor or doctor.',
};

export const SMALL_PARTS: Caution = {
  code: 'small_parts',
  title: 'No small parts for children under 3',
  text:
    'Buttons, beads, poppers and other small parts can come loose and be swallowed. Kept features such as buttons are removed, ' +
    'or replaced with embroidery, on pieces for young children.',
  source: 'Small-parts rules for children under 3 (US 16 CFR 1501; EU EN 71-1 for toys). Local rules apply.',
};

export const PREWASH_REQUIRED: Caution = {
  code: 'prewash_required',
  title: 'Fabrics are pre-washed',
  text: 'Every fabric in a piece for a young child is washed before it is cut, to remove finishes and test for colour run.',
  source: 'Common practice for children\u2019s textiles.',
};

/** The cautions that apply to a commission for someone of this age. */
export function cautionsFor(ageGroup: AgeGroup): Caution[] {
  if (ageGroup === 'baby_under_1') return [SAFE_SLEEP, SMALL_PARTS, PREWASH_REQUIRED];
  if (ageGroup === 'child_under_3') return [SMALL_PARTS, PREWASH_REQUIRED];
  return [];
}

/** Kept features to take off a piece for a young child (buttons and the like). */
export function featuresToRemove(ageGroup: AgeGroup, features: readonly KeptFeature[]): KeptFeature[] {
  if (ageGroup !== 'baby_under_1' && ageGroup !== 'child_under_3') return [];
  return features.filter((f) => f.kind === 'buttons' || /button|bead|popper|snap|sequin/i.test(f.position));
}
