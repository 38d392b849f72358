import { z } from 'zod';
import { FIBRE, STOCK_TEXT_LIMITS } from '@keepstitch/shared';
import { AppError } from '../core/app-error';
import { present, sortFor } from '../core/field-policy';
import { securedRouter, signedInUser } from '../core/secured-router';
import { lengthField, lengthUnitSchema, toMillimetres } from '../core/length-input';
import { optionalText, parseId, parseInput } from '../core/validate';
import { StockFabricModel } from '../models/stock-fabric-model';

const fields = {
  name: z.string({ message: 'Name the fabric.' }).trim().min(1, 'Name the fabric.').max(STOCK_TEXT_LIMITS.name, `A name can be at most ${STOCK_TEXT_LIMITS.name} characters.`),
  colour: optionalText(STOCK_TEXT_LIMITS.colour, 'Colour'),
  fibre: z.enum(FIBRE.values, { message: 'Choose the fibre.' }),
  width: lengthField('Width'),
  length: lengthField('Length on hand'),
  unit: lengthUnitSchema.default('in'),
  costPence: z.number({ message: 'Cost must be an amount in pence.' }).int('Cost must be whole pence.').min(0, 'Cost cannot be negative.').max(1_000_000).nullable().optional(),
  costUnit: z.enum(['metre', 'yard'], { message: 'Cost is per metre or per yard.' }),
  supplier: optionalText(STOCK_TEXT_LIMITS.supplier, 'Supplier'),
  notes: optionalText(STOCK_TEXT_LIMITS.notes, 'Notes'),
};

const sized = <T extends { width?: string; length?: string; unit: 'in' | 'cm' | 'mm' | 'm' | 'yd' }>({ width, length, unit, ...rest }: T, ctx: z.RefinementCtx) => ({
  ...rest,
  ...(width !== undefined ? { widthMm: toMillimetres(width, unit, ctx, 'width') } : {}),
  ...(length !== undefined ? { lengthMm: toMillimetres(length, unit, ctx, 'length') } : {}),
});

/** A new fabric is cotton priced per metre unless it says otherwise; a change never falls back to those. */
export const createStockSchema = z
  .object({ ...fields, fibre: fields.fibre.default('cotton'), costUnit: fields.costUnit.default('metre') })
  .strict()
  .transform(sized);
export const updateStockSchema = z
  .object(fields)
  .partial()
  .extend({ unit: lengthUnitSchema.default('in') })
  .strict()
  .transform(sized);

/** Workroom assistants see the stock for cutting, but not what it cost. */
const view = (f: StockFabricModel, user: Express.User) => present('stock', user.role, f.toJSON());

export function stockRouter() {
  const r = securedRouter('/api/stock');

  r.get('/', async (req, res) => {
    const items = await StockFabricModel.query().orderByRaw(`lower(${sortFor('stock', signedInUser(req).role, 'name', 'name')})`).orderBy('id');
    res.json({ items: items.map((f) => view(f, signedInUser(req))) });
  });
  r.post('/', async (req, res) => {
    const input = parseInput(createStockSchema, req.body, 'fabric');
    res.status(201).json(view(await StockFabricModel.query().insertAndFetch(input as Partial<StockFabricModel>), signedInUser(req)));
  });
  r.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], 'That fabric');
    const input = parseInput(updateStockSchema, req.body, 'fabric');
    if (Object.keys(input).length === 0) throw new AppError(400, 'validation', 'Send at least one field to change.');
    const fabric = await StockFabricModel.query().patchAndFetchById(id, input as Partial<StockFabricModel>);
    if (!fabric) throw AppError.notFound('That fabric');
    res.json(view(fabric, signedInUser(req)));
  });
  r.delete('/:id', async (req, res) => {
    const count = await StockFabricModel.query().deleteById(parseId(req.params['id'], 'That fabric'));
    if (!count) throw AppError.notFound('That fabric');
    res.status(204).end();
  });
  return r.router;
}
