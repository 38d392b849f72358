import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { CommissionModel } from '../models/commission-model';
import { GarmentModel } from '../models/garment-model';

/**
 * Finding a record the caller may see: the owner and the workroom see every
 * commission, a client only its own. What a caller may not see is answered
 * as not found, the same as what does not exist. Every area that works on a
 * commission or a garment asks here first.
 */
export async function findVisibleCommission(user: Express.User, id: number, trx?: Knex.Transaction) {
  const c = await CommissionModel.query(trx).modify('visibleTo', user).findById(id);
  if (!c) throw AppError.notFound('That commission');
  return c;
}

/** A garment the user may see (a client: only on its own commissions), with its commission. */
export async function findVisibleGarment(user: Express.User, id: number, trx?: Knex.Transaction) {
  const garment = await GarmentModel.query(trx).findById(id);
  if (!garment) throw AppError.notFound('That garment');
  const commission = await CommissionModel.query(trx).modify('visibleTo', user).findById(garment.commissionId);
  if (!commission) throw AppError.notFound('That garment');
  return { garment, commission };
}
