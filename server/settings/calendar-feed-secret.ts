import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import { StudioSettingsModel } from '../models/settings-model';

const hashOf = (secret: string) => createHash('sha256').update(secret, 'utf8').digest();

/** The feed's address for a secret. */
export function calendarFeedUrl(appUrl: string, secret: string): string {
  return `${appUrl.replace(/\/$/, '')}/api/calendar/${secret}.ics`;
}

/**
 * Makes a new secret for the calendar feed and keeps only its hash: the
 * address is shown once, and the previous one stops working at once.
 */
export async function makeCalendarFeedSecret(): Promise<{ secret: string; madeAt: Date }> {
  const secret = randomBytes(32).toString('base64url');
  const madeAt = new Date();
  await StudioSettingsModel.query().patch({ calendarFeedHash: hashOf(secret).toString('hex'), calendarFeedMadeAt: madeAt, updatedAt: madeAt }).where('id', 1);
  return { secret, madeAt };
}

/** Turns the feed off: no address works until a new one is made. */
export async function stopCalendarFeed(): Promise<void> {
  await StudioSettingsModel.query().patch({ calendarFeedHash: null, calendarFeedMadeAt: null, updatedAt: new Date() }).where('id', 1);
}

/** Whether the secret is the feed's current one, compared in constant time. */
export async function isCalendarFeedSecret(secret: string): Promise<boolean> {
  const row = await StudioSettingsModel.query().select('calendarFeedHash').findById(1);
  if (!row?.calendarFeedHash) return false;
  return timingSafeEqual(hashOf(secret), Buffer.from(row.calendarFeedHash, 'hex'));
}
