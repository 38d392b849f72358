import ical from 'ical-generator';
import { STAGE_LABELS } from '@keepstitch/shared';
import { addDays, today as todayIs } from '../core/calendar';
import { CommissionModel } from '../models/commission-model';

/** Deadlines this long past stay in the feed, so last month's still show in a calendar. */
const PAST_DAYS = 90;

/**
 * The studio's deadlines as an iCalendar document: one all-day event per
 * commission that has a deadline, titled with the commission and its stage.
 * It carries nothing about the client (no name, address, e-mail or phone),
 * since a calendar feed is read by whatever holds its address.
 */
export async function deadlinesCalendar(appUrl: string, today = todayIs()): Promise<string> {
  const commissions = await CommissionModel.query()
    .select('id', 'title', 'stage', 'deadline', 'updatedAt')
    .whereNotNull('deadline')
    .where('deadline', '>=', addDays(today, -PAST_DAYS))
    .whereNot('stage', 'cancelled')
    .orderBy('deadline')
    .orderBy('id');
  const calendar = ical({ name: 'Keepstitch deadlines', prodId: { company: 'Keepstitch', product: 'Deadlines', language: 'EN' }, ttl: 60 * 60 });
  const host = new URL(appUrl).host;
  for (const c of commissions) {
    const day = c.deadline!;
    calendar.createEvent({
      id: `commission-${c.id}-deadline@${host}`,
      // A date, not an instant: built at UTC midnight and written as a date (DTSTART;VALUE=DATE).
      start: new Date(`${day}T00:00:00Z`),
      end: new Date(`${addDays(day, 1)}T00:00:00Z`),
      allDay: true,
      timezone: 'UTC',
      stamp: c.updatedAt,
      summary: `Due: ${c.title} (${STAGE_LABELS[c.stage]})`,
      description: `Stage: ${STAGE_LABELS[c.stage]}`,
      url: `${appUrl.replace(/\/$/, '')}/commissions/${c.id}`,
    });
  }
  return calendar.toString();
}
