import type { Knex } from 'knex';
import { deriveCustody, type CustodyEvent, type CustodyState } from '@keepstitch/shared';
import { CommissionModel } from '../models/commission-model';
import { CustodyEventModel, GarmentModel } from '../models/garment-model';

export type CustodyStates = Map<number, { state: CustodyState; events: CustodyEventModel[] }>;

/** The derived custody state of each garment, from its events. */
export async function custodyStates(garmentIds: number[], trx?: Knex.Transaction): Promise<CustodyStates> {
  if (!garmentIds.length) return new Map();
  const events = await CustodyEventModel.query(trx).whereIn('garmentId', garmentIds).orderBy('at').orderBy('id');
  return statesFrom(garmentIds, events);
}

/** Every custody event of a commission's garments, in order: read beside the garments rather than after them. */
export function commissionCustodyEvents(commissionId: number) {
  return GarmentModel.relatedQuery('events').for(CommissionModel.relatedQuery('garments').for(commissionId).select('garments.id'));
}

/** Each garment's state from the events read for them (events of other garments are ignored). */
export function statesFrom(garmentIds: number[], events: CustodyEventModel[]): CustodyStates {
  const byGarment = new Map<number, CustodyEventModel[]>(garmentIds.map((id) => [id, []]));
  for (const e of events) byGarment.get(e.garmentId)?.push(e);
  const out: CustodyStates = new Map();
  for (const [id, list] of byGarment) out.set(id, { events: list, state: deriveCustody(list.map(toCustodyEvent)) });
  return out;
}

export function toCustodyEvent(e: CustodyEventModel): CustodyEvent {
  return { id: e.id, kind: e.kind, at: e.at.toISOString(), place: e.place, returnMethod: e.returnMethod, trackingRef: e.trackingRef, note: e.note, correctsEventId: e.correctsEventId };
}
