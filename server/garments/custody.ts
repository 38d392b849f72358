import type { Knex } from 'knex';
import { deriveCustody, type CustodyEvent, type CustodyState } from '@keepstitch/shared';
import { CustodyEventModel } from './garment-model';

/** The derived custody state of each garment, from its events. */
export async function custodyStates(garmentIds: number[], trx?: Knex.Transaction): Promise<Map<number, { state: CustodyState; events: CustodyEventModel[] }>> {
  const out = new Map<number, { state: CustodyState; events: CustodyEventModel[] }>();
  if (!garmentIds.length) return out;
  const events = await CustodyEventModel.query(trx).whereIn('garmentId', garmentIds).orderBy('at').orderBy('id');
  for (const id of garmentIds) out.set(id, { state: deriveCustody([]), events: [] });
  for (const e of events) out.get(e.garmentId)!.events.push(e);
  for (const [id, entry] of out) {
    out.set(id, { events: entry.events, state: deriveCustody(entry.events.map(toCustodyEvent)) });
  }
  return out;
}

export function toCustodyEvent(e: CustodyEventModel): CustodyEvent {
  return { id: e.id, kind: e.kind, at: e.at.toISOString(), place: e.place, returnMethod: e.returnMethod, trackingRef: e.trackingRef, correctsEventId: e.correctsEventId };
}
