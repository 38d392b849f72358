import { openCustody, type StageFacts } from '@keepstitch/shared';
import type { Knex } from 'knex';
import { CommissionModel } from '../models/commission-model';
import { custodyStates } from '../garments/custody';
import { paymentState } from '../payments/payment-state';

/** Facts for the stage rules: garments expected and received, money owing, garments whose custody is open. */
export async function stageFacts(commissionId: number, trx?: Knex.Transaction): Promise<StageFacts> {
  const garments = await CommissionModel.relatedQuery('garments', trx).for(commissionId).select('garments.id', 'garments.description').orderBy('garments.id');
  // One connection in a transaction: one query at a time.
  const states = await custodyStates(garments.map((g) => g.id), trx);
  return factsFrom(states, await paymentState(commissionId, trx), garments);
}

export function factsFrom(
  states: Awaited<ReturnType<typeof custodyStates>>,
  money: Awaited<ReturnType<typeof paymentState>>,
  garments: ReadonlyArray<{ id: number; description: string }>,
): StageFacts {
  const live = [...states.values()].filter((s) => s.state.status !== 'withdrawn');
  return {
    garmentCount: live.length,
    garmentsReceived: live.filter((s) => s.state.received).length,
    balanceDue: !!money && !money.balancePaid && money.balancePence > 0,
    openCustody: openCustody(garments.map((g) => ({ description: g.description, status: states.get(g.id)?.state.status ?? 'expected' }))),
  };
}
