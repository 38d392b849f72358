// Mattress and cot sizes, and the quilt size a bed needs: mattress plus a drop
// on each exposed side plus an optional pillow tuck. Sizes are width x length
// (Size.height is the length from head to foot).

import { DomainError } from './errors';
import { Length, requireNonNegative, requirePositive, Size } from './measure';

export type BedRegion = 'UK' | 'EU' | 'US';
export type BedKind = 'bed' | 'cot' | 'crib';

export interface MattressPreset {
  id: string;
  region: BedRegion;
  kind: BedKind;
  name: string;
  size: Size;
  /** Where the size comes from. */
  source: string;
}

const UK_TABLE = 'UK mattress trade tables (not fixed by law)';
const EU_TABLE = 'EU mattress trade tables (200 cm long)';
const US_TABLE = 'US mattress trade tables';

function cm(id: string, region: BedRegion, kind: BedKind, name: string, width: number, length: number, source: string): MattressPreset {
  return { id, region, kind, name, size: { width: Length.centimetres(width), height: Length.centimetres(length) }, source };
}

function inch(id: string, kind: BedKind, name: string, width: string, length: string, source: string): MattressPreset {
  return { id, region: 'US', kind, name, size: { width: Length.inches(width), height: Length.inches(length) }, source };
}

/** Standard mattress and cot sizes. */
export const MATTRESS_PRESETS: readonly MattressPreset[] = Object.freeze([
  cm('uk-small-single', 'UK', 'bed', 'UK small single', 75, 190, UK_TABLE),
  cm('uk-single', 'UK', 'bed', 'UK single', 90, 190, UK_TABLE),
  cm('uk-small-double', 'UK', 'bed', 'UK small double', 120, 190, UK_TABLE),
  cm('uk-double', 'UK', 'bed', 'UK double', 135, 190, UK_TABLE),
  cm('uk-king', 'UK', 'bed', 'UK king', 150, 200, UK_TABLE),
  cm('uk-super-king', 'UK', 'bed', 'UK super king', 180, 200, UK_TABLE),
  cm('uk-cot', 'UK', 'cot', 'UK cot', 60, 120, 'common practice'),
  cm('uk-cot-bed', 'UK', 'cot', 'UK cot bed', 70, 140, 'common practice'),
  cm('eu-80', 'EU', 'bed', 'EU 80 x 200', 80, 200, EU_TABLE),
  cm('eu-90', 'EU', 'bed', 'EU 90 x 200', 90, 200, EU_TABLE),
  cm('eu-100', 'EU', 'bed', 'EU 100 x 200', 100, 200, EU_TABLE),
  cm('eu-140', 'EU', 'bed', 'EU 140 x 200', 140, 200, EU_TABLE),
  cm('eu-160', 'EU', 'bed', 'EU 160 x 200', 160, 200, EU_TABLE),
  cm('eu-180', 'EU', 'bed', 'EU 180 x 200', 180, 200, EU_TABLE),
  inch('us-twin', 'bed', 'US twin', '38', '75', `${US_TABLE} (38 to 39 in wide)`),
  inch('us-full', 'bed', 'US full', '54', '75', US_TABLE),
  inch('us-queen', 'bed', 'US queen', '60', '80', US_TABLE),
  inch('us-king', 'bed', 'US king', '76', '80', US_TABLE),
  inch('us-california-king', 'bed', 'US California king', '72', '84', US_TABLE),
  inch('us-crib', 'crib', 'US full-size crib (interior)', '28', '52.375', '16 CFR 1241 (interior 28 x 52 3/8 in, +/- 5/8 in)'),
]);

/** The preset with this id; throws DomainError "unknown-preset" otherwise. */
export function mattressPreset(id: string): MattressPreset {
  const preset = MATTRESS_PRESETS.find((p) => p.id === id);
  if (!preset) {
    throw new DomainError('unknown-preset', `Expected a mattress size such as uk-double or us-queen; got "${id}".`, 'mattress');
  }
  return preset;
}

/** Presets for one region (all when none is given). */
export function mattressPresets(region?: BedRegion): MattressPreset[] {
  return MATTRESS_PRESETS.filter((p) => region === undefined || p.region === region);
}

/** Common practice drop range per exposed side: 10 to 16 in. */
export const TYPICAL_DROP = Object.freeze({ min: Length.inches(10), max: Length.inches(16) });

const MAX_DROP = Length.centimetres(100);

export interface BedQuiltInput {
  /** Mattress width x length. */
  mattress: Size;
  /** Overhang on each exposed side (may be 0 for a bed topper). */
  drop: Length;
  /** Extra length to tuck under the pillows; default 0 (common practice 10 to 15 in). */
  pillowTuck?: Length;
  /** Which sides hang down; default both long sides and the foot. */
  exposed?: { left?: boolean; right?: boolean; foot?: boolean };
}

export interface BedQuiltSize {
  size: Size;
  parts: { mattress: Size; left: Length; right: Length; foot: Length; pillowTuck: Length };
}

/** Finished quilt size for a bed: mattress + drop per exposed side + pillow tuck. */
export function quiltSizeForBed(input: BedQuiltInput): BedQuiltSize {
  const mattress = {
    width: requirePositive(input.mattress.width, 'mattress width'),
    height: requirePositive(input.mattress.height, 'mattress length'),
  };
  const drop = requireNonNegative(input.drop, 'drop');
  if (drop.gt(MAX_DROP)) {
    throw new DomainError('too-large', 'Expected a drop of at most 100 cm per side.', 'drop');
  }
  const pillowTuck = requireNonNegative(input.pillowTuck ?? Length.zero, 'pillow tuck');
  const exposed = { left: true, right: true, foot: true, ...input.exposed };
  const left = exposed.left ? drop : Length.zero;
  const right = exposed.right ? drop : Length.zero;
  const foot = exposed.foot ? drop : Length.zero;
  return {
    size: { width: mattress.width.plus(left).plus(right), height: mattress.height.plus(foot).plus(pillowTuck) },
    parts: { mattress, left, right, foot, pillowTuck },
  };
}

/** A custom finished size (wall hanging, play mat, throw), checked to be positive. */
export function customSize(width: Length, height: Length): Size {
  return { width: requirePositive(width, 'width'), height: requirePositive(height, 'height') };
}
