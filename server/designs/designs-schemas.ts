import { z } from 'zod';
import { BLOCK_KINDS, GARMENT_GROUP_ID, GARMENT_GROUP_LIMITS, blockInputsByName, garmentGroupProblems, type DesignBody, type KindInput, DESIGN_TEXT_LIMITS } from '@keepstitch/shared';
import { optionalText, recordId } from '../core/validate';

/** An exact length in millimetres as a decimal string, above zero and at most 50 m. */
const mm = (label: string) =>
  z
    .string({ message: `${label} is required.` })
    .regex(/^[0-9]{1,5}(\.[0-9]{1,12})?$/, `${label} must be millimetres, such as 304.8.`)
    .refine((v) => Number(v) > 0 && Number(v) <= 50_000, `${label} must be above 0 and at most 50 m.`);
const id = recordId('Choose a garment or stock fabric by its id.');
const count = (label: string, max: number) => z.number({ message: `${label} must be a whole number.` }).int(`${label} must be a whole number.`).min(1, `${label} must be at least 1.`).max(max, `${label} can be at most ${max}.`);

const groupId = z.string({ message: 'A group id is required.' }).regex(GARMENT_GROUP_ID, 'A group id is lower-case letters, digits and dashes, such as g1.');

const fabricSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('garment'), garmentId: id }).strict(),
  z.object({ kind: z.literal('group'), groupId }).strict(),
  z.object({ kind: z.literal('stock'), stockId: id }).strict(),
]);

const { name: groupName, garments: groupGarments, groups: groupCount } = GARMENT_GROUP_LIMITS;
/** A group of garments; it may have none yet (the planner can then cut nothing from it). */
const groupSchema = z
  .object({
    id: groupId,
    name: z.string({ message: 'Name the group.' }).trim().min(1, 'Name the group.').max(groupName, `A group name can be at most ${groupName} characters.`),
    garmentIds: z.array(id).max(groupGarments, `A group can hold at most ${groupGarments} garments.`),
  })
  .strict();

/** The check of a block's input, as the block kinds declare it (kinds sharing a field declare it alike). */
function inputSchema(input: KindInput) {
  switch (input.type) {
    case 'count':
      return z.number().int().min(input.min).max(input.max).optional();
    case 'length':
      return mm(input.label).optional();
    case 'choice':
      return z.enum(input.options.map((o) => o.value)).optional();
  }
}

const blockSchema = z
  .object({
    id: z.string().regex(/^[A-Z][A-Z0-9]{0,3}$/, 'A block id is a capital letter, such as A.'),
    name: z.string().trim().min(1, 'Name the block.').max(DESIGN_TEXT_LIMITS.blockName, `A block name can be at most ${DESIGN_TEXT_LIMITS.blockName} characters.`),
    kind: z.enum(BLOCK_KINDS, { message: 'Choose a block kind.' }),
    ...Object.fromEntries([...blockInputsByName()].map(([name, inputs]) => [name, inputSchema(inputs[0]!)])),
  })
  .strict();

/** The design as the owner saves it; derivation checks the rest (plates fit, geese even...). */
export const designBodySchema = z
  .object({
    units: z.enum(['imperial', 'metric']),
    target: z.object({ preset: z.string().max(DESIGN_TEXT_LIMITS.preset).nullable(), dropMm: mm('Drop').nullable(), widthMm: mm('Target width'), lengthMm: mm('Target length') }).strict(),
    layout: z
      .object({
        setting: z.enum(['straight', 'on-point']),
        rows: count('Rows', 60),
        columns: count('Columns', 60),
        blockMm: mm('Block size'),
        sashing: z.object({ widthMm: mm('Sashing width'), cornerstones: z.boolean() }).strict().nullable(),
        borders: z.array(mm('Border width')).max(6, 'At most 6 borders.'),
      })
      .strict(),
    blocks: z.array(blockSchema).min(1, 'Add at least one block.').max(12, 'At most 12 block kinds.'),
    pattern: z.array(z.string().max(4)).max(3600),
    groups: z.array(groupSchema).max(groupCount, `At most ${groupCount} groups of garments.`).default([]),
    assignments: z
      .array(
        z
          .object({
            target: z.discriminatedUnion('kind', [
              z.object({ kind: z.literal('position'), index: z.number().int().min(0).max(3599) }).strict(),
              z.object({ kind: z.literal('piece'), key: z.string().min(1).max(60) }).strict(),
            ]),
            fabric: fabricSchema,
          })
          .strict(),
      )
      .max(4000),
    finishing: z
      .object({
        bindingStockId: id.nullable(),
        bindingStripMm: mm('Binding strip width'),
        backingStockId: id.nullable(),
        waddingStockId: id.nullable(),
        prewash: z.boolean(),
        shrinkPercent: z.string().regex(/^[0-9]{1,2}(\.[0-9]{1,3})?$/, 'Shrinkage is a percentage such as 3.').refine((v) => Number(v) < 20, 'Shrinkage must be under 20%.'),
      })
      .strict(),
    rules: z.object({ minimumPerGarment: z.number().int().min(0).max(100) }).strict(),
  })
  .strict()
  .superRefine((body, ctx) => {
    // Ids and names of their own, and every group an assignment names is in the list.
    for (const [path, message] of Object.entries(garmentGroupProblems(body as DesignBody))) ctx.addIssue({ code: 'custom', path: path.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p)), message });
  });

export const saveDesignSchema = z.object({ body: designBodySchema, note: optionalText(DESIGN_TEXT_LIMITS.versionNote, 'Note') }).strict();

export const clientResponseSchema = z
  .object({
    response: z.enum(['approved', 'changes_requested'], { message: 'Approve the design or ask for a change.' }),
    note: optionalText(DESIGN_TEXT_LIMITS.responseNote, 'Note'),
  })
  .strict()
  .refine((v) => v.response === 'approved' || !!v.note, { message: 'Say what you would like changed.', path: ['note'] });

export const paperSchema = z.object({ paper: z.enum(['a4', 'letter']).default('a4') });
