import { ALL_STAGES, type Stage } from '@keepstitch/shared';
import { AppError } from '../core/app-error';
import { mayUse, present, sortFor, whereMatches } from '../core/field-policy';
import { pageOf } from '../core/paging';
import { daysBetween, today } from '../core/calendar';
import { ClientModel } from '../models/client-model';
import { CommissionModel, HoursModel, StageMoveModel } from '../models/commission-model';
import { findVisibleCommission } from './commission-access';
import type { CreateCommissionInput, ListCommissionsQuery, UpdateCommissionInput } from './commissions-schemas';

const NOT_FOUND = 'That commission';

/** What each role may see of a commission's own columns. */
export function commissionView(c: CommissionModel, user: Express.User) {
  const open = c.stage !== 'delivered' && c.stage !== 'cancelled';
  const daysLeft = c.deadline ? daysBetween(today(), c.deadline) : null;
  return present('commission', user.role, {
    id: c.id,
    clientId: c.clientId,
    client: c.client ? { id: c.client.id, name: c.client.name } : undefined,
    title: c.title,
    kind: c.kind,
    recipient: c.recipient,
    ageGroup: c.ageGroup,
    occasion: c.occasion,
    sizePreset: c.sizePreset,
    widthMm: c.widthMm,
    lengthMm: c.lengthMm,
    deadline: c.deadline,
    daysLeft,
    overdue: open && daysLeft !== null && daysLeft < 0,
    notes: c.notes,
    stage: c.stage,
    createdAt: c.createdAt,
    updatedAt: c.updatedAt,
    budgetPence: c.budgetPence,
  });
}

export async function listCommissions(user: Express.User, q: ListCommissionsQuery) {
  const query = CommissionModel.query()
    .modify('visibleTo', user)
    .join('clients as client', 'client.id', 'commissions.clientId')
    .select('commissions.*', 'client.name as clientName');
  const may = (field: string) => mayUse('commission', user.role, 'filter', field);
  if (q.stage?.length && may('stage')) query.whereIn('commissions.stage', q.stage);
  if (q.clientId && may('clientId')) query.where('commissions.clientId', q.clientId);
  if (q.dueWithinDays !== undefined && may('deadline')) {
    query
      .whereNotNull('commissions.deadline')
      .whereRaw('commissions.deadline <= ?::date + ?::int', [today(), q.dueWithinDays])
      .whereNotIn('commissions.stage', ['delivered', 'cancelled']);
  }
  if (q.q) whereMatches(query, [['commission', 'commissions'], ['client', 'client']], user.role, q.q);
  const sort = sortFor('commission', user.role, q.sort, 'deadline');
  const column = { deadline: 'commissions.deadline', createdAt: 'commissions.createdAt', title: 'commissions.title', stage: 'commissions.stage' }[sort];
  if (sort === 'stage') {
    // The stages' own order (shared with the app), not the alphabet.
    query.orderByRaw(`array_position(?::text[], commissions.stage::text) ${q.dir}`, [ALL_STAGES]);
  } else {
    query.orderBy(column, q.dir, q.dir === 'asc' ? 'last' : 'first');
  }
  query.orderBy('commissions.id', q.dir);
  const { results, total } = await pageOf(query, q.page, q.pageSize);
  return {
    items: results.map((c) => ({ ...commissionView(c, user), client: { id: c.clientId, name: (c as CommissionModel & { clientName: string }).clientName } })),
    total,
  };
}

export async function createCommission(user: Express.User, input: CreateCommissionInput) {
  const client = await ClientModel.query().findById(input.clientId);
  if (!client) throw new AppError(400, 'validation', 'The chosen client does not exist.', { clientId: 'No such client.' });
  return CommissionModel.transaction(async (trx) => {
    const c = await CommissionModel.query(trx).insertAndFetch({ ...(input as Partial<CommissionModel>), stage: 'enquiry' });
    await StageMoveModel.query(trx).insert({ commissionId: c.id, fromStage: null, toStage: 'enquiry', movedBy: user.id, note: 'Opened' });
    return commissionView(c, user);
  });
}

export async function updateCommission(user: Express.User, id: number, input: UpdateCommissionInput) {
  if (Object.keys(input).length === 0) throw new AppError(400, 'validation', 'Send at least one field to change.');
  const c = await CommissionModel.query().patchAndFetchById(id, input as Partial<CommissionModel>);
  if (!c) throw AppError.notFound(NOT_FOUND);
  return commissionView(c, user);
}

export async function logHours(user: Express.User, id: number, input: { stage: string; hours: number; workedOn: string; note?: string | null }) {
  await findVisibleCommission(user, id);
  return HoursModel.query().insertAndFetch({ commissionId: id, stage: input.stage as Stage, hours: input.hours.toFixed(2), workedOn: input.workedOn, note: input.note ?? null, userId: user.id });
}

