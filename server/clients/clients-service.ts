import { AppError } from '../core/app-error';
import { fieldsFor, mayUse, present, sortFor, whereMatches } from '../core/field-policy';
import { pageOf } from '../core/paging';
import { UserModel } from '../models/user-model';
import { ClientModel } from '../models/client-model';
import { CommissionModel } from '../models/commission-model';
import { PaymentModel } from '../models/payment-model';
import { QuoteModel } from '../models/quote-model';
import { readTogether } from '../core/read-together';
import type { CreateClientInput, ListClientsQuery, UpdateClientInput } from './clients-schemas';

const NOT_FOUND = 'That client';

/** Starts a query over the clients this user may see, with the columns their role may see. */
function visibleClients(user: Express.User) {
  const query = ClientModel.query().select(fieldsFor('client', user.role, 'see').filter((f) => f !== 'invitationState').map((f) => `clients.${f}`));
  if (user.role === 'client') query.where('id', user.clientId ?? -1);
  return query;
}

/** A client as this user may see it. */
export const clientView = (c: ClientModel, user: Express.User) => present('client', user.role, c.toJSON());

export async function listClients(user: Express.User, q: ListClientsQuery) {
  const query = visibleClients(user);
  if (q.q) whereMatches(query, [['client', 'clients']], user.role, q.q);
  const sort = sortFor('client', user.role, q.sort, 'name');
  const column = sort === 'name' ? ClientModel.raw('lower(name)') : sort;
  const { results, total } = await pageOf(query.orderBy(column as string, q.dir).orderBy('id', q.dir), q.page, q.pageSize);
  return { items: results.map((c) => clientView(c, user)), total };
}

/** Where the client's invitation to their page stands: never sent, sent and not yet used, or they can sign in. */
export type InvitationState = 'not_sent' | 'sent' | 'accepted';

async function invitationStateOf(client: ClientModel): Promise<InvitationState> {
  const users = await UserModel.query().select('awaitingPassword').where('clientId', client.id);
  if (users.some((u) => !u.awaitingPassword)) return 'accepted';
  return client.invitationSentAt && users.length ? 'sent' : 'not_sent';
}

/** One client as this user may see it, with its invitation's state for the owner. */
async function singleView(client: ClientModel, user: Express.User) {
  const view: Record<string, unknown> = clientView(client, user);
  if (mayUse('client', user.role, 'see', 'invitationState')) view['invitationState'] = await invitationStateOf(client);
  return view;
}

export async function getClient(user: Express.User, id: number) {
  const client = await visibleClients(user).findById(id);
  if (!client) throw AppError.notFound(NOT_FOUND);
  return singleView(client, user);
}

export async function createClient(user: Express.User, input: CreateClientInput) {
  return singleView(await ClientModel.query().insertAndFetch({ ...input, portfolioConsent: input.portfolioConsent ?? false }), user);
}

export async function updateClient(user: Express.User, id: number, input: UpdateClientInput) {
  const client = await ClientModel.query().patchAndFetchById(id, input);
  if (!client) throw AppError.notFound(NOT_FOUND);
  return singleView(client, user);
}

/** Deletes a client and their portal sign-in; records of work attached to them keep it from going. */
export async function deleteClient(id: number): Promise<void> {
  await ClientModel.transaction(async (trx) => {
    const users = await UserModel.query(trx).select('id').where('clientId', id);
    if (users.length) {
      await trx.raw(`DELETE FROM session WHERE (sess -> 'passport' -> 'user' ->> 'id')::int = ANY(?)`, [users.map((u) => u.id)]);
      await UserModel.query(trx).delete().where('clientId', id);
    }
    const deleted = await ClientModel.query(trx).deleteById(id);
    if (!deleted) throw AppError.notFound(NOT_FOUND);
  });
}

/**
 * A client's record for the owner: the client, their commissions (newest
 * first), every quote sent on them and every payment that moved money, read
 * in one round trip. Drafts and checkouts never paid are left out: they are
 * not yet part of the client's history.
 */
export async function clientRecord(user: Express.User, id: number) {
  const [clients, commissions, quotes, payments] = await readTogether([
    visibleClients(user).where('id', id),
    CommissionModel.query().select('id', 'title', 'kind', 'stage', 'deadline', 'createdAt').where('clientId', id).orderBy('createdAt', 'desc').orderBy('id', 'desc'),
    QuoteModel.query()
      .select('quotes.id', 'quotes.commissionId', 'quotes.version', 'quotes.status', 'quotes.totalPence', 'quotes.depositPence', 'quotes.sentAt', 'quotes.acceptedAt')
      .join('commissions', 'commissions.id', 'quotes.commissionId')
      .where('commissions.clientId', id)
      .whereNot('quotes.status', 'draft')
      .orderBy('quotes.sentAt', 'desc')
      .orderBy('quotes.id', 'desc'),
    PaymentModel.query()
      .select('payments.id', 'payments.commissionId', 'payments.kind', 'payments.amountPence', 'payments.receivedPence', 'payments.status', 'payments.method', 'payments.reference', 'payments.paidAt', 'payments.receiptNumber')
      .join('commissions', 'commissions.id', 'payments.commissionId')
      .where('commissions.clientId', id)
      .whereNotIn('payments.status', ['pending', 'expired'])
      .orderBy('payments.paidAt', 'desc')
      .orderBy('payments.id', 'desc'),
  ]);
  const client = clients[0];
  if (!client) throw AppError.notFound(NOT_FOUND);
  return {
    client: clientView(client, user),
    commissions: commissions.map((c) => present('commission', user.role, c.toJSON())),
    quotes: quotes.map((q) => present('quote', user.role, q.toJSON())),
    payments: payments.map((p) => present('payment', user.role, p.toJSON())),
  };
}
