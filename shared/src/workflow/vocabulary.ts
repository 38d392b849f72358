/**
 * The words of a commission and its garments, as stored values with the
 * labels the maker reads. Shared by the server's validation and the app's forms.
 */
const labelled = <T extends string>(labels: Record<T, string>) => {
  // An object literal of labels has at least one key, so the tuple is never empty (what z.enum asks for).
  const [first, ...rest] = Object.keys(labels) as T[];
  const values: readonly [T, ...T[]] = [first!, ...rest];
  return {
    values,
    labels: labels as Readonly<Record<T, string>>,
    /** Value and label pairs in order, for a select. */
    options: values.map((value) => ({ value, label: labels[value] })) as ReadonlyArray<{ value: T; label: string }>,
  };
};

export const COMMISSION_KIND = labelled({
  memory_quilt: 'Memory quilt',
  cushion: 'Cushion',
  wall_hanging: 'Wall hanging',
  baby_quilt: 'Baby quilt',
  other: 'Other',
});
export type CommissionKind = (typeof COMMISSION_KIND.values)[number];

export const AGE_GROUP = labelled({
  baby_under_1: 'Baby under 12 months',
  child_under_3: 'Child under 3',
  child: 'Child',
  adult: 'Adult',
});
export type AgeGroup = (typeof AGE_GROUP.values)[number];

export const FIBRE = labelled({
  cotton: 'Cotton',
  linen: 'Linen',
  denim: 'Denim',
  flannel: 'Flannel',
  wool: 'Wool',
  silk: 'Silk',
  polyester: 'Polyester',
  blend: 'Blend',
  knit_jersey: 'Knit jersey',
  other: 'Other',
});
export type Fibre = (typeof FIBRE.values)[number];

export const CONSTRUCTION = labelled({ woven: 'Woven', knit: 'Knit' });
export type Construction = (typeof CONSTRUCTION.values)[number];

export const PRINT = labelled({ plain: 'Plain', directional: 'Directional print', non_directional: 'Non-directional print' });
export type Print = (typeof PRINT.values)[number];

export const FEATURE = labelled({ pocket: 'Pocket', label: 'Label', embroidery: 'Embroidery', buttons: 'Buttons', other: 'Other' });
export type FeatureKind = (typeof FEATURE.values)[number];

export const PREWASH = labelled({ not_washed: 'Not washed yet', washed: 'Pre-washed', do_not_wash: 'Not to be washed' });
export type Prewash = (typeof PREWASH.values)[number];

export const COLOUR_RUN = labelled({ untested: 'Not tested', passed: 'Passed (no colour ran)', failed: 'Failed (colour ran)' });
export type ColourRun = (typeof COLOUR_RUN.values)[number];

export const GRAIN = labelled({ vertical: 'Runs along the height', horizontal: 'Runs along the width' });
export type Grain = (typeof GRAIN.values)[number];

export interface KeptFeature {
  kind: FeatureKind;
  /** Where on the garment, in the maker's words ("left chest"). */
  position: string;
}

/** A fibre's name on a card or label; a garment not yet identified reads "Fibre not known". */
export function fibreName(fibre: string): string {
  return fibre === 'unknown' ? 'Fibre not known' : ((FIBRE.labels as Record<string, string>)[fibre] ?? fibre);
}

/** What of one fibre went into a piece, for the care card: the client's garments, then the studio's fabrics. */
export interface FibreGroup {
  fibre: string;
  garments: string[];
  studio: string[];
}

/** "Blue shirt, Check shirt; Navy binding cotton (studio fabric)". */
export function fibreLine(group: Pick<FibreGroup, 'garments' | 'studio'>): string {
  const studio = group.studio.length ? `${group.studio.join(', ')} (studio fabric${group.studio.length > 1 ? 's' : ''})` : '';
  return [group.garments.join(', '), studio].filter(Boolean).join('; ');
}
