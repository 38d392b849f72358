import { ALL_STAGES, cautionsFor, checkStageMove, featuresToRemove, moveNeedsNote, nextStages, type Stage, type StageFacts } from '@keepstitch/shared';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { mayUse, present, sortFor, whereMatches } from '../core/field-policy';
import { pageOf } from '../core/paging';
import { readTogether } from '../core/read-together';
import { daysBetween, today } from '../core/calendar';
import { ClientModel } from '../models/client-model';
import { GarmentModel, PanelModel } from '../models/garment-model';
import { commissionCustodyEvents, custodyStates, statesFrom } from '../garments/custody';
import { PhotoModel } from '../models/photo-model';
import { CommissionModel, HoursModel, StageMoveModel } from '../models/commission-model';
import type { CreateCommissionInput, ListCommissionsQuery, UpdateCommissionInput } from './commissions-schemas';
import { acceptedQuote, paidPayments, paymentState, paymentStateFrom } from '../payments/payment-state';
import { enqueueMail } from '../mail/outbox-service';
import { readyMail } from '../mail/mail-templates';
import { StudioSettingsModel } from '../models/settings-model';

const NOT_FOUND = 'That commission';


/** What each role may see of a commission's own columns. */
function shape(c: CommissionModel, user: Express.User) {
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
    items: results.map((c) => ({ ...shape(c, user), client: { id: c.clientId, name: (c as CommissionModel & { clientName: string }).clientName } })),
    total,
  };
}

async function findVisible(user: Express.User, id: number, trx?: Knex.Transaction) {
  const c = await CommissionModel.query(trx).modify('visibleTo', user).findById(id);
  if (!c) throw AppError.notFound(NOT_FOUND);
  return c;
}

/** Counts for the stage rules: garments expected and received. */
async function stageFacts(commissionId: number, trx?: Knex.Transaction): Promise<StageFacts> {
  const garments = await GarmentModel.query(trx).select('id').where('commissionId', commissionId);
  // One connection in a transaction: one query at a time.
  const states = await custodyStates(garments.map((g) => g.id), trx);
  return factsFrom(states, await paymentState(commissionId, trx));
}

function factsFrom(states: Awaited<ReturnType<typeof custodyStates>>, money: Awaited<ReturnType<typeof paymentState>>): StageFacts {
  const live = [...states.values()].filter((s) => s.state.status !== 'withdrawn');
  return { garmentCount: live.length, garmentsReceived: live.filter((s) => s.state.received).length, balanceDue: !!money && !money.balancePaid && money.balancePence > 0 };
}

/** Groups rows by a key, keeping their order. */
function groupBy<T>(rows: T[], key: (row: T) => number | null): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const row of rows) {
    const k = key(row);
    if (k === null) continue;
    const list = out.get(k);
    if (list) list.push(row);
    else out.set(k, [row]);
  }
  return out;
}

export async function getCommission(user: Express.User, id: number) {
  const staff = user.role !== 'client';
  // Everything the page shows, read in one round trip; the later reads are discarded when the commission is not visible.
  const [found, garments, events, panels, photos, moves, quotes, paid, hourRows] = await readTogether([
    CommissionModel.query()
      .modify('visibleTo', user)
      .join('clients as client', 'client.id', 'commissions.clientId')
      .select('commissions.*', 'client.name as clientName')
      .where('commissions.id', id),
    GarmentModel.query().where('commissionId', id).orderBy('id'),
    commissionCustodyEvents(id),
    // A client sees no panels and no hours: those reads come back empty.
    PanelModel.query().select('panels.*').join('garments', 'garments.id', 'panels.garmentId').where('garments.commissionId', id).modify((q) => (staff ? q : q.whereRaw('false'))).orderBy('panels.id'),
    PhotoModel.query().where('commissionId', id).orderBy('id'),
    StageMoveModel.query().where('commissionId', id).orderBy('movedAt').orderBy('id'),
    acceptedQuote(id),
    paidPayments(id),
    hoursQuery(id).modify((q) => (staff ? q : q.whereRaw('false'))),
  ]);
  const c = found[0];
  if (!c) throw AppError.notFound(NOT_FOUND);
  c.client = ClientModel.fromJson({ id: c.clientId, name: (c as CommissionModel & { clientName: string }).clientName }, { skipValidation: true });
  const money = paymentStateFrom(quotes[0], paid);
  const hours = staff ? hoursFrom(hourRows) : undefined;
  const states = statesFrom(garments.map((g) => g.id), events);
  const panelsOf = groupBy(panels, (p) => p.garmentId);
  const photosOf = groupBy(photos, (p) => p.garmentId);
  const facts = factsFrom(states, money);
  const garmentViews = garments.map((g) => {
    const custody = states.get(g.id)!;
    return present('garment', user.role, {
      ...garmentView(g, user),
      status: custody.state.status,
      received: custody.state.received,
      washed: custody.state.washed,
      place: staff ? custody.state.place : undefined,
      removeForSafety: featuresToRemove(c.ageGroup, g.features),
      panels: staff ? (panelsOf.get(g.id) ?? []) : undefined,
      photos: (photosOf.get(g.id) ?? []).map((p) => p.toPublic()),
    });
  });
  return present('commission', user.role, {
    ...shape(c, user),
    cautions: cautionsFor(c.ageGroup),
    garments: garmentViews,
    progressPhotos: photos.filter((p) => p.kind === 'progress').map((p) => p.toPublic()),
    stageHistory: moves.map((m) => ({ id: m.id, fromStage: m.fromStage, toStage: m.toStage, note: staff ? m.note : undefined, movedAt: m.movedAt })),
    hours,
    nextStages: staff ? nextStages(c.stage, facts) : undefined,
    facts,
  });
}

/** The hours logged on a commission, with who logged them, in the order worked. */
function hoursQuery(commissionId: number) {
  return HoursModel.query()
    .select('hoursLogged.*', 'users.name as userName')
    .leftJoin('users', 'users.id', 'hoursLogged.userId')
    .where('commissionId', commissionId)
    .orderBy('workedOn')
    .orderBy('hoursLogged.id');
}

/** Hours per stage and in all, two decimals. */
function hoursFrom(rows: HoursModel[]) {
  const byStage: Record<string, string> = {};
  let total = 0;
  for (const r of rows) {
    byStage[r.stage] = (Number(byStage[r.stage] ?? 0) + Number(r.hours)).toFixed(2);
    total += Number(r.hours);
  }
  return { entries: rows, byStage, total: total.toFixed(2) };
}

/** The fields of a garment each role may see (a client sees its own words and the basics). */
export function garmentView(g: GarmentModel, user: Express.User) {
  return present('garment', user.role, g.toJSON() as Omit<GarmentModel, keyof import('objection').Model>);
}

export async function createCommission(user: Express.User, input: CreateCommissionInput) {
  const client = await ClientModel.query().findById(input.clientId);
  if (!client) throw new AppError(400, 'validation', 'The chosen client does not exist.', { clientId: 'No such client.' });
  return CommissionModel.transaction(async (trx) => {
    const c = await CommissionModel.query(trx).insertAndFetch({ ...(input as Partial<CommissionModel>), stage: 'enquiry' });
    await StageMoveModel.query(trx).insert({ commissionId: c.id, fromStage: null, toStage: 'enquiry', movedBy: user.id, note: 'Opened' });
    return shape(c, user);
  });
}

export async function updateCommission(user: Express.User, id: number, input: UpdateCommissionInput) {
  if (Object.keys(input).length === 0) throw new AppError(400, 'validation', 'Send at least one field to change.');
  const c = await CommissionModel.query().patchAndFetchById(id, input as Partial<CommissionModel>);
  if (!c) throw AppError.notFound(NOT_FOUND);
  return shape(c, user);
}

export async function moveStage(user: Express.User, id: number, to: Stage, note: string | null | undefined, appUrl: string) {
  return CommissionModel.transaction(async (trx) => {
    const c = await CommissionModel.query(trx).findById(id).forUpdate();
    if (!c) throw AppError.notFound(NOT_FOUND);
    const facts = await stageFacts(id, trx);
    const check = checkStageMove(c.stage, to, facts);
    if (!check.ok) throw new AppError(409, 'stage_move_refused', check.reason);
    if (moveNeedsNote(c.stage, to) && !note) {
      throw new AppError(400, 'validation', 'Say why in a note when moving back or cancelling.', { note: 'A note is needed for this move.' });
    }
    await StageMoveModel.query(trx).insert({ commissionId: id, fromStage: c.stage, toStage: to, note: note ?? null, movedBy: user.id });
    await CommissionModel.query(trx).patch({ stage: to }).findById(id);
    let mailed = false;
    if (to === 'ready') mailed = await tellClientReady(trx, c, appUrl);
    return { id, stage: to, nextStages: nextStages(to, facts), mailed };
  });
}

/** "Your piece is ready", queued with the move that made it so. */
async function tellClientReady(trx: Knex.Transaction, c: CommissionModel, appUrl: string): Promise<boolean> {
  const client = await ClientModel.query(trx).findById(c.clientId);
  if (!client?.email) return false;
  const settings = await StudioSettingsModel.query(trx).findById(1);
  const money = await paymentState(c.id, trx);
  const mail = readyMail({ clientName: client.name, studioName: settings!.studioName, title: c.title, balancePence: money?.balancePaid ? 0 : (money?.balancePence ?? 0), link: `${appUrl}/portal/${c.id}` });
  await enqueueMail(trx, { kind: 'ready', to: client.email, ...mail, commissionId: c.id });
  return true;
}

export async function logHours(user: Express.User, id: number, input: { stage: string; hours: number; workedOn: string; note?: string | null }) {
  await findVisible(user, id);
  return HoursModel.query().insertAndFetch({ commissionId: id, stage: input.stage as Stage, hours: input.hours.toFixed(2), workedOn: input.workedOn, note: input.note ?? null, userId: user.id });
}

export { findVisible as findVisibleCommission };
