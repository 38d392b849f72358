import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { invitationMail, passwordResetMail } from '../mail/mail-templates';
import { enqueueMail } from '../mail/outbox-service';
import { ClientModel } from '../models/client-model';
import { StudioSettingsModel } from '../models/settings-model';
import { UserModel } from '../models/user-model';
import { issuePasswordLink } from '../users/password-links';
import { hashPassword } from '../users/password';

export const setPasswordUrl = (appUrl: string, token: string) => `${appUrl}/set-password?token=${encodeURIComponent(token)}`;

/** Whether the client can sign in already: a sign-in of theirs with a password of its own. */
export async function clientHasSignIn(trx: Knex.Transaction | undefined, clientId: number): Promise<boolean> {
  const user = await UserModel.query(trx).where({ clientId, awaitingPassword: false }).first();
  return user !== undefined;
}

/**
 * Makes (or brings up to date) the client's sign-in that waits for its
 * password, and a new invitation link for it; an earlier link stops working.
 * Refuses when the client has no e-mail, can sign in already, or its e-mail
 * belongs to someone else's sign-in.
 */
export async function inviteWithin(trx: Knex.Transaction, client: ClientModel, appUrl: string): Promise<string> {
  if (!client.email) throw new AppError(409, 'no_email', `Add an e-mail address for ${client.name} before inviting them to their page.`);
  if (await clientHasSignIn(trx, client.id)) throw new AppError(409, 'has_sign_in', `${client.name} can already sign in. If they have forgotten the password, they can ask for a new one on the sign-in page.`);
  const taken = await UserModel.query(trx).whereRaw('lower(email) = lower(?)', [client.email]).whereRaw('client_id IS DISTINCT FROM ?', [client.id]).first();
  if (taken) throw new AppError(409, 'conflict', `${client.email} is already the sign-in of someone else. Give ${client.name} another e-mail address first.`);
  let user = await UserModel.query(trx).where({ clientId: client.id }).forUpdate().first();
  if (user) {
    user = await UserModel.query(trx).patchAndFetchById(user.id, { email: client.email, name: client.name });
  } else {
    // No password until the link is used: a hash of random bytes nobody knows.
    user = await UserModel.query(trx).insertAndFetch({
      email: client.email,
      name: client.name,
      role: 'client',
      clientId: client.id,
      awaitingPassword: true,
      passwordHash: await hashPassword(randomBytes(32).toString('base64url')),
    });
  }
  const token = await issuePasswordLink(trx, user.id, 'invitation');
  await ClientModel.query(trx).patch({ invitationSentAt: new Date() }).findById(client.id);
  return setPasswordUrl(appUrl, token);
}

/** The owner invites a client to their page: the invitation goes into the outbox. */
export async function inviteClient(clientId: number, appUrl: string): Promise<void> {
  await ClientModel.transaction(async (trx) => {
    const client = await ClientModel.query(trx).findById(clientId).forUpdate();
    if (!client) throw AppError.notFound('That client');
    const link = await inviteWithin(trx, client, appUrl);
    const settings = await StudioSettingsModel.current(trx);
    await enqueueMail(trx, { kind: 'invitation', to: client.email!, ...invitationMail({ clientName: client.name, studioName: settings.studioName, link }) });
  });
}

/** Shortest time a "forgot password" request takes, so a known address cannot be told from an unknown one by timing. */
export const RESET_REQUEST_MIN_MS = 400;

/**
 * "Forgot password": a reset link to the sign-in with this e-mail, if there
 * is one; earlier reset links stop working. The caller answers the same
 * either way.
 */
export async function requestPasswordReset(email: string, appUrl: string): Promise<void> {
  await UserModel.transaction(async (trx) => {
    const user = await UserModel.query(trx).whereRaw('lower(email) = lower(?)', [email]).first();
    if (!user) return;
    const token = await issuePasswordLink(trx, user.id, 'reset');
    const settings = await StudioSettingsModel.current(trx);
    await enqueueMail(trx, { kind: 'password-reset', to: user.email, ...passwordResetMail({ name: user.name, studioName: settings.studioName, link: setPasswordUrl(appUrl, token) }) });
  });
}
