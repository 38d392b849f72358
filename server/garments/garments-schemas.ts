import { z } from 'zod';
import Decimal from 'decimal.js';
import { COLOUR_RUN, CONSTRUCTION, CUSTODY_TEXT_LIMITS as CUSTODY, FEATURE, FIBRE, GARMENT_TEXT_LIMITS as TEXT, GRAIN, KEPT_FEATURE_LIMITS, Length, PREWASH, PRINT, formatLength, type PanelFeature, PANEL_TEXT_LIMITS } from '@keepstitch/shared';
import { optionalText, recordId } from '../core/validate';
import { lengthField, lengthUnitSchema, toMillimetres } from '../core/length-input';

const oneOf = <T extends string>(values: readonly [T, ...T[]], message: string) => z.enum(values, { message });

const featureSchema = z
  .object({
    kind: oneOf(FEATURE.values, 'Choose the kind of feature.'),
    position: z.string().trim().max(KEPT_FEATURE_LIMITS.position, `A position can be at most ${KEPT_FEATURE_LIMITS.position} characters.`).default(''),
  })
  .strict();

const garmentFields = {
  description: z.string({ message: 'Describe the garment.' }).trim().min(1, 'Describe the garment.').max(TEXT.description, `A description can be at most ${TEXT.description} characters.`),
  whose: optionalText(TEXT.whose, 'Whose it was'),
  story: optionalText(TEXT.story, 'Story'),
  fibre: oneOf(FIBRE.values, 'Choose the fibre.').nullable().optional(),
  construction: oneOf(CONSTRUCTION.values, 'Choose woven or knit.').optional(),
  colour: optionalText(TEXT.colour, 'Colour'),
  print: oneOf(PRINT.values, 'Choose the kind of print.').optional(),
  condition: optionalText(TEXT.condition, 'Condition'),
  features: z.array(featureSchema).max(KEPT_FEATURE_LIMITS.features, `At most ${KEPT_FEATURE_LIMITS.features} kept features.`).optional(),
  prewash: oneOf(PREWASH.values, 'Choose the pre-wash status.').optional(),
  colourRun: oneOf(COLOUR_RUN.values, 'Choose the colour-run result.').optional(),
  returnsToClient: optionalText(TEXT.returnsToClient, 'What returns to the client'),
};

/** Staff may set every field; a client announces with its own words and the basics. */
export const createGarmentSchema = z.object(garmentFields).strict();
export const clientGarmentSchema = z
  .object({ description: garmentFields.description, whose: garmentFields.whose, story: garmentFields.story, fibre: garmentFields.fibre, colour: garmentFields.colour })
  .strict();
export const updateGarmentSchema = z
  .object(garmentFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change.');

export const custodyEventSchema = z
  .discriminatedUnion(
    'kind',
    [
      z.object({ kind: z.literal('received'), note: optionalText(CUSTODY.note, 'Note'), place: optionalText(CUSTODY.place, 'Place') }).strict(),
      z.object({ kind: z.literal('washed'), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z.object({ kind: z.literal('stored'), place: z.string({ message: 'Say where it is stored (box or shelf).' }).trim().min(1, 'Say where it is stored (box or shelf).').max(CUSTODY.place, `A place can be at most ${CUSTODY.place} characters.`), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z.object({ kind: z.literal('moved'), place: z.string({ message: 'Say where it was moved to.' }).trim().min(1, 'Say where it was moved to.').max(CUSTODY.place, `A place can be at most ${CUSTODY.place} characters.`), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z.object({ kind: z.literal('cut'), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z
        .object({
          kind: z.literal('returned'),
          returnMethod: z.enum(['in_person', 'post'], { message: 'Say how it was returned: in person or by post.' }),
          trackingRef: optionalText(CUSTODY.trackingRef, 'Tracking reference'),
          note: optionalText(CUSTODY.note, 'Note'),
        })
        .strict()
        .refine((v) => v.returnMethod !== 'post' || !!v.trackingRef, { path: ['trackingRef'], message: 'Give the tracking reference for a garment sent by post.' }),
      z.object({ kind: z.literal('used'), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z
        .object({
          kind: z.literal('leftovers_returned'),
          returnMethod: z.enum(['in_person', 'post'], { message: 'Say how the leftovers were returned: in person or by post.' }),
          trackingRef: optionalText(CUSTODY.trackingRef, 'Tracking reference'),
          note: optionalText(CUSTODY.note, 'Note'),
        })
        .strict()
        .refine((v) => v.returnMethod !== 'post' || !!v.trackingRef, { path: ['trackingRef'], message: 'Give the tracking reference for leftovers sent by post.' }),
      z.object({ kind: z.literal('withdrawn'), note: optionalText(CUSTODY.note, 'Note') }).strict(),
      z
        .object({
          kind: z.literal('correction'),
          correctsEventId: recordId('Say which entry this corrects.'),
          note: z.string({ message: 'Say what was wrong.' }).trim().min(1, 'Say what was wrong.').max(CUSTODY.note, `A note can be at most ${CUSTODY.note} characters.`),
        })
        .strict(),
    ],
    { message: 'Choose what happened: received, washed, stored, moved, cut, used in the piece, returned whole, leftovers returned, withdrawn or correction.' },
  );

/** A kept feature as typed: its name, the top-left corner from the panel's top-left, and its size. */
const panelFeatureSchema = z
  .object({
    name: z.string({ message: 'Name the kept feature (for example "breast pocket").' }).trim().min(1, 'Name the kept feature (for example "breast pocket").').max(PANEL_TEXT_LIMITS.featureName, 'A feature name can be at most 60 characters.'),
    x: lengthField('From the left', { allowZero: true }),
    y: lengthField('From the top', { allowZero: true }),
    width: lengthField('Width'),
    height: lengthField('Height'),
  })
  .strict();

const panelFields = {
  name: z.string({ message: 'Name the panel (for example "back").' }).trim().min(1, 'Name the panel (for example "back").').max(PANEL_TEXT_LIMITS.name, `A panel name can be at most ${PANEL_TEXT_LIMITS.name} characters.`),
  width: lengthField('Width'),
  height: lengthField('Height'),
  unit: lengthUnitSchema.default('in'),
  grain: oneOf(GRAIN.values, 'Choose which way the grain runs.'),
  features: z.array(panelFeatureSchema, { message: 'Kept features must be a list.' }).max(20, 'At most 20 kept features on a panel.'),
};

type TypedFeature = z.infer<typeof panelFeatureSchema>;

function featuresToMillimetres(features: TypedFeature[], unit: z.infer<typeof lengthUnitSchema>, ctx: z.RefinementCtx): PanelFeature[] {
  return features.map((f, i) => ({
    name: f.name,
    xMm: toMillimetres(f.x, unit, ctx, ['features', i, 'x'], { allowZero: true }),
    yMm: toMillimetres(f.y, unit, ctx, ['features', i, 'y'], { allowZero: true }),
    widthMm: toMillimetres(f.width, unit, ctx, ['features', i, 'width']),
    heightMm: toMillimetres(f.height, unit, ctx, ['features', i, 'height']),
  }));
}

const both = (mm: Decimal.Value) => {
  const length = Length.millimetres(new Decimal(mm));
  return `${formatLength(length, 'imperial')} (${formatLength(length, 'metric')})`;
};

/**
 * Where kept features do not lie inside a panel of this size: a message for
 * the field to correct, keyed `features.<i>.width` or `features.<i>.height`.
 */
export function featuresOutside(panel: { widthMm: string; heightMm: string }, features: readonly PanelFeature[]): Record<string, string> {
  const fields: Record<string, string> = {};
  features.forEach((f, i) => {
    const right = new Decimal(f.xMm).plus(f.widthMm);
    const bottom = new Decimal(f.yMm).plus(f.heightMm);
    if (right.gt(panel.widthMm)) {
      fields[`features.${i}.width`] = `The ${f.name} runs past the panel's right edge: it ends ${both(right)} from the left, and the panel is ${both(panel.widthMm)} wide.`;
    }
    if (bottom.gt(panel.heightMm)) {
      fields[`features.${i}.height`] = `The ${f.name} runs past the panel's bottom edge: it ends ${both(bottom)} from the top, and the panel is ${both(panel.heightMm)} high.`;
    }
  });
  return fields;
}

/** Adds a field issue for each kept feature outside the panel (only when every length was read). */
function checkFeaturesInside(panel: { widthMm: string; heightMm: string; features: PanelFeature[] }, ctx: z.RefinementCtx): void {
  const read = [panel.widthMm, panel.heightMm, ...panel.features.flatMap((f) => [f.xMm, f.yMm, f.widthMm, f.heightMm])];
  if (!read.every((v) => typeof v === 'string')) return;
  for (const [path, message] of Object.entries(featuresOutside(panel, panel.features))) {
    ctx.addIssue({ code: 'custom', path: path.split('.').map((k) => (/^\d+$/.test(k) ? Number(k) : k)), message });
  }
}

/** A new panel's grain runs along its height unless it says otherwise; a change never falls back to that. */
export const panelSchema = z
  .object({ ...panelFields, grain: panelFields.grain.default('vertical'), features: panelFields.features.default([]) })
  .strict()
  .transform(({ width, height, unit, features, ...rest }, ctx) => {
    const panel = {
      ...rest,
      widthMm: toMillimetres(width, unit, ctx, 'width'),
      heightMm: toMillimetres(height, unit, ctx, 'height'),
      features: featuresToMillimetres(features, unit, ctx),
    };
    checkFeaturesInside(panel, ctx);
    return panel;
  });

export const updatePanelSchema = z
  .object(panelFields)
  .partial()
  .extend({ unit: lengthUnitSchema.default('in') })
  .strict()
  .transform(({ width, height, unit, features, ...rest }, ctx) => ({
    ...rest,
    ...(width !== undefined ? { widthMm: toMillimetres(width, unit, ctx, 'width') } : {}),
    ...(height !== undefined ? { heightMm: toMillimetres(height, unit, ctx, 'height') } : {}),
    ...(features !== undefined ? { features: featuresToMillimetres(features, unit, ctx) } : {}),
  }));
