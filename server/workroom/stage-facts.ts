import type { StageFacts } from '@keepstitch/shared';
import type { Knex } from 'knex';
import { CommissionModel } from '../models/commission-model';
import { custodyStates } from '../garments/custody';
import { paymentState } from '../payments/payment-state';

/** Counts for the stage rules: garments expected and received. */
export async function stageFacts(commissionId: number, trx?: Knex.Transaction): Promise<StageFacts> {
  const garments = await CommissionModel.relatedQuery('garments', trx).for(commissionId).select('garments.id');
  // One connection in a transaction: one query at a time.
  const states = await custodyStates(garments.map((g) => g.id), trx);
  return factsFrom(states, await paymentState(commissionId, trx));
}

export function factsFrom(states: Awaited<ReturnType<typeof custodyStates>>, money: Awaited<ReturnType<typeof paymentState>>): StageFacts {
  const live = [...states.values()].filter((s) => s.state.status !== 'withdrawn');
  return { garmentCount: live.length, garmentsReceived: live.filter((s) => s.state.received).length, balanceDue: !!money && !money.balancePaid && money.balancePence > 0 };
}
