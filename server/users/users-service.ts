import { AppError } from '../core/app-error';
import { present } from '../core/field-policy';
import { hashPassword, verifyPassword } from './password';
import { ClientModel } from '../models/client-model';
import { UserModel } from '../models/user-model';
import type { CreateUserInput } from './users-schemas';

/** The studio's sign-ins, as the owner sees them. */
export async function listUsers() {
  const users = await UserModel.query().orderBy('role').orderByRaw('lower(name)');
  return users.map((u) => present('user', 'owner', u.toPublic()));
}

export async function createUser(input: CreateUserInput) {
  const taken = await UserModel.query().whereRaw('lower(email) = ?', [input.email]).first();
  if (taken) throw new AppError(409, 'conflict', 'That e-mail address already has a sign-in.', { email: 'Already in use.' });
  if (input.clientId !== undefined) {
    const client = await ClientModel.query().findById(input.clientId);
    if (!client) throw new AppError(400, 'validation', 'The chosen client record does not exist.', { clientId: 'No such client.' });
  }
  const user = await UserModel.query().insertAndFetch({
    email: input.email,
    name: input.name,
    role: input.role,
    clientId: input.clientId ?? null,
    passwordHash: await hashPassword(input.password),
  });
  return present('user', 'owner', user.toPublic());
}

/** Sets a new password; every session of that user ends. */
export async function resetPassword(id: number, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await UserModel.transaction(async (trx) => {
    const count = await UserModel.query(trx).patch({ passwordHash, passwordChangedAt: new Date(), awaitingPassword: false }).findById(id);
    if (!count) throw AppError.notFound('That user');
    await trx.raw(`DELETE FROM session WHERE (sess -> 'passport' -> 'user' ->> 'id')::int = ?`, [id]);
  });
}

/** A signed-in user changes their own password, proving the current one; every session of theirs ends. */
export async function changeOwnPassword(id: number, currentPassword: string, newPassword: string): Promise<void> {
  const user = await UserModel.query().findById(id);
  if (!user || !(await verifyPassword(currentPassword, user.passwordHash))) {
    throw new AppError(400, 'validation', 'The current password is not right, so the password was not changed.', {
      currentPassword: 'This is not your current password.',
    });
  }
  await resetPassword(id, newPassword);
}
