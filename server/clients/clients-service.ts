import { AppError } from '../core/app-error';
import { pageOf } from '../core/paging';
import { UserModel } from '../users/user-model';
import { ClientModel } from './client-model';
import type { CreateClientInput, ListClientsQuery, UpdateClientInput } from './clients-schemas';

const NOT_FOUND = 'That client';

/** Starts a query over the clients this user may see, with the columns their role may see. */
function visibleClients(user: Express.User) {
  const query = ClientModel.query();
  if (user.role === 'workroom') query.select(...ClientModel.workroomColumns);
  if (user.role === 'client') query.where('id', user.clientId ?? -1);
  return query;
}

export async function listClients(user: Express.User, q: ListClientsQuery) {
  const query = visibleClients(user);
  if (q.q) query.modify('matching', q.q);
  // Workroom users see names only, so they may only sort by name.
  const sort = user.role === 'workroom' ? 'name' : q.sort;
  const column = sort === 'name' ? ClientModel.raw('lower(name)') : sort;
  if (!query.hasSelects()) query.select('clients.*');
  const { results, total } = await pageOf(query.orderBy(column as string, q.dir).orderBy('id', q.dir), q.page, q.pageSize);
  return { items: results, total };
}

export async function getClient(user: Express.User, id: number) {
  const client = await visibleClients(user).findById(id);
  if (!client) throw AppError.notFound(NOT_FOUND);
  return client;
}

export function createClient(input: CreateClientInput) {
  return ClientModel.query().insertAndFetch({ ...input, portfolioConsent: input.portfolioConsent ?? false });
}

export async function updateClient(id: number, input: UpdateClientInput) {
  const client = await ClientModel.query().patchAndFetchById(id, input);
  if (!client) throw AppError.notFound(NOT_FOUND);
  return client;
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
