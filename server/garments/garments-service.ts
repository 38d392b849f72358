import { checkCustodyEvent, featuresToRemove, type CustodyKind } from '@keepstitch/shared';
import type { z } from 'zod';
import { AppError } from '../core/app-error';
import { present } from '../core/field-policy';
import { parseInput } from '../core/validate';
import { findVisibleCommission, findVisibleGarment } from '../commissions/commission-access';
import { garmentView } from './garment-view';
import { custodyStates } from './custody';
import { CustodyEventModel, GarmentModel, PanelModel } from '../models/garment-model';
import { clientGarmentSchema, createGarmentSchema, featuresOutside, type custodyEventSchema, type panelSchema, type updateGarmentSchema, type updatePanelSchema } from './garments-schemas';

export async function createGarment(user: Express.User, commissionId: number, body: unknown) {
  const commission = await findVisibleCommission(user, commissionId);
  const input = user.role === 'client' ? parseInput(clientGarmentSchema, body, 'garment') : parseInput(createGarmentSchema, body, 'garment');
  return GarmentModel.transaction(async (trx) => {
    const garment = await GarmentModel.query(trx).insertAndFetch({ ...(input as Partial<GarmentModel>), features: (input as { features?: [] }).features ?? [], commissionId: commission.id, createdBy: user.id });
    await CustodyEventModel.query(trx).insert({
      garmentId: garment.id,
      kind: 'announced',
      note: user.role === 'client' ? 'Added by the client in the portal' : 'Logged by the studio',
      userId: user.id,
    });
    return present('garment', user.role, { ...garmentView(garment, user), status: 'expected' as const });
  });
}

export async function getGarment(user: Express.User, id: number) {
  const { garment, commission } = await findVisibleGarment(user, id);
  const staff = user.role !== 'client';
  const [custody, panels, photos] = await Promise.all([
    custodyStates([id]),
    staff ? garment.$relatedQuery('panels') : Promise.resolve(undefined),
    garment.$relatedQuery('photos'),
  ]);
  const { state, events } = custody.get(id)!;
  return present('garment', user.role, {
    ...garmentView(garment, user),
    status: state.status,
    received: state.received,
    washed: state.washed,
    place: staff ? state.place : undefined,
    removeForSafety: featuresToRemove(commission.ageGroup, garment.features),
    events: events.map((e) =>
      staff
        ? e
        : { id: e.id, kind: e.kind, at: e.at, returnMethod: e.returnMethod, trackingRef: e.trackingRef },
    ),
    panels,
    photos: photos.map((p) => p.toPublic()),
  });
}

export async function updateGarment(user: Express.User, id: number, input: z.infer<typeof updateGarmentSchema>) {
  await findVisibleGarment(user, id);
  const garment = await GarmentModel.query().patchAndFetchById(id, input as Partial<GarmentModel>);
  return garmentView(garment, user);
}

export async function addCustodyEvent(user: Express.User, id: number, input: z.infer<typeof custodyEventSchema>) {
  return GarmentModel.transaction(async (trx) => {
    await GarmentModel.query(trx).findById(id).forUpdate();
    await findVisibleGarment(user, id, trx);
    const { state, events } = (await custodyStates([id], trx)).get(id)!;
    const check = checkCustodyEvent(state, input.kind as CustodyKind);
    if (!check.ok) throw new AppError(409, 'custody_refused', check.reason);
    if (input.kind === 'correction') {
      const target = events.find((e) => e.id === input.correctsEventId);
      if (!target) throw new AppError(400, 'validation', 'That entry is not in this garment\u2019s log.', { correctsEventId: 'Not an entry of this garment.' });
      if (target.kind === 'correction' || target.kind === 'announced') {
        throw new AppError(409, 'custody_refused', 'That entry cannot be corrected; add the right event instead.');
      }
      if (events.some((e) => e.kind === 'correction' && e.correctsEventId === target.id)) {
        throw new AppError(409, 'custody_refused', 'That entry has already been corrected.');
      }
    }
    const event = await CustodyEventModel.query(trx).insertAndFetch({ ...(input as Partial<CustodyEventModel>), garmentId: id, userId: user.id });
    const after = (await custodyStates([id], trx)).get(id)!.state;
    return { event, state: after };
  });
}

export async function addPanel(user: Express.User, garmentId: number, input: z.output<typeof panelSchema>) {
  await findVisibleGarment(user, garmentId);
  return PanelModel.query().insertAndFetch({ ...(input as Partial<PanelModel>), garmentId });
}

async function findPanel(user: Express.User, id: number) {
  const panel = await PanelModel.query().findById(id);
  if (!panel) throw AppError.notFound('That panel');
  await findVisibleGarment(user, panel.garmentId);
  return panel;
}

export async function updatePanel(user: Express.User, id: number, input: z.output<typeof updatePanelSchema>) {
  const panel = await findPanel(user, id);
  if (Object.keys(input).length === 0) throw new AppError(400, 'validation', 'Send at least one field to change.');
  // The kept features must still lie inside the panel as it will be.
  const size = { widthMm: input.widthMm ?? panel.widthMm, heightMm: input.heightMm ?? panel.heightMm };
  const outside = featuresOutside(size, input.features ?? panel.features ?? []);
  if (Object.keys(outside).length > 0) {
    // A resize alone is reported on the size that no longer holds the features.
    const fields = input.features
      ? outside
      : Object.fromEntries(Object.entries(outside).map(([key, message]) => [key.endsWith('.width') ? 'width' : 'height', message]));
    throw new AppError(400, 'validation', 'A kept feature would lie outside the panel.', fields);
  }
  return PanelModel.query().patchAndFetchById(id, input as Partial<PanelModel>);
}

export async function deletePanel(user: Express.User, id: number) {
  await findPanel(user, id);
  await PanelModel.query().deleteById(id);
}
