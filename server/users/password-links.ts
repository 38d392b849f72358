import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { PasswordLinkModel, type PasswordLinkPurpose } from '../models/password-link-model';
import { UserModel } from '../models/user-model';
import { hashPassword } from './password';

/** How long a link works: an invitation a week, a reset an hour. */
export const LINK_LIFETIME_MS: Record<PasswordLinkPurpose, number> = {
  invitation: 7 * 24 * 3600 * 1000,
  reset: 3600 * 1000,
};

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Makes a new link for the user: 32 random bytes, of which only the hash is
 * stored. Earlier unused links of the same purpose stop working. Returns the
 * token, which exists nowhere else once the mail carrying it is written.
 */
export async function issuePasswordLink(trx: Knex.Transaction, userId: number, purpose: PasswordLinkPurpose, now = new Date()): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await PasswordLinkModel.query(trx).patch({ usedAt: now }).where({ userId, purpose }).whereNull('usedAt');
  await PasswordLinkModel.query(trx).insert({ userId, purpose, tokenHash: hashToken(token), createdAt: now, expiresAt: new Date(now.getTime() + LINK_LIFETIME_MS[purpose]) });
  return token;
}

export const BAD_LINK_MESSAGE = 'This link has expired or has already been used. Ask for a new one with "Forgot your password?" on the sign-in page, or ask the studio to invite you again.';

/**
 * Sets a password with a link's token: the link is used up, every other
 * unused link of the user stops working, and every session of theirs ends.
 * Returns the user, or refuses with 400 when the link is unknown, used or old.
 */
export async function setPasswordWithLink(token: string, password: string, now = new Date()): Promise<UserModel> {
  const passwordHash = await hashPassword(password);
  return UserModel.transaction(async (trx) => {
    const link = await PasswordLinkModel.query(trx).where('tokenHash', hashToken(token)).forUpdate().first();
    if (!link || link.usedAt || link.expiresAt.getTime() <= now.getTime()) {
      throw new AppError(400, 'bad_link', BAD_LINK_MESSAGE, { token: BAD_LINK_MESSAGE });
    }
    await PasswordLinkModel.query(trx).patch({ usedAt: now }).where('userId', link.userId).whereNull('usedAt');
    const user = await UserModel.query(trx).patchAndFetchById(link.userId, { passwordHash, passwordChangedAt: now, awaitingPassword: false });
    await trx.raw(`DELETE FROM session WHERE (sess -> 'passport' -> 'user' ->> 'id')::int = ?`, [link.userId]);
    return user;
  });
}
