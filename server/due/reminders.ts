import type { Knex } from 'knex';
import { addDays, today as todayIs } from '../core/calendar';
import { readTogether } from '../core/read-together';
import { CommissionModel } from '../models/commission-model';
import { PaymentModel } from '../models/payment-model';
import { ReminderSentModel, type ReminderKind } from '../models/reminder-model';
import { StudioSettingsModel } from '../models/settings-model';
import { enqueueMail } from '../mail/outbox-service';
import { balanceDueMail, garmentsLateMail, quoteExpiryMail, type Mail } from '../mail/mail-templates';
import { acceptedQuotesQuery, balancesFrom, expectedGarmentsFrom, expiringQuotesQuery, openGarmentEventsQuery, openGarmentsQuery, paidOnOpenQuery } from './overview';

/** A sent quote's reminder goes this many days before it runs out (or later, when sent closer to it). */
export const QUOTE_REMINDER_DAYS = 3;
/** The balance reminder goes this many days before the deadline. */
export const BALANCE_REMINDER_DAYS = 7;

/** One reminder the data calls for: its key (kind, subject, due date) and the commission it is about. */
export interface DueReminder {
  kind: ReminderKind;
  subjectId: number;
  dueOn: string;
  commissionId: number;
  mail: (p: { clientName: string; studioName: string; link: string }) => Mail;
  link: string;
}

/**
 * Which reminders are due today, worked out from the data alone (quotes,
 * payments, garments and the switches), so nothing about the schedule is
 * lost when the server stops.
 */
export async function dueReminders(settings: StudioSettingsModel, today: string): Promise<DueReminder[]> {
  const [expiring, accepted, paid, garments, events] = await readTogether([
    expiringQuotesQuery(today, settings.remindQuoteExpiry ? addDays(today, QUOTE_REMINDER_DAYS) : '0001-01-01'),
    settings.remindBalanceDue ? acceptedQuotesQuery() : acceptedQuotesQuery().whereRaw('false'),
    settings.remindBalanceDue ? paidOnOpenQuery() : paidOnOpenQuery().whereRaw('false'),
    settings.remindGarmentsLate ? openGarmentsQuery() : openGarmentsQuery().whereRaw('false'),
    settings.remindGarmentsLate ? openGarmentEventsQuery() : openGarmentEventsQuery().whereRaw('false'),
  ] as const);
  const out: DueReminder[] = [];

  for (const q of expiring) {
    // The query selects the commission's title beside the quote's columns.
    const { title } = q as typeof q & { title: string };
    out.push({
      kind: 'quote_expiry',
      subjectId: q.id,
      dueOn: q.validUntil!,
      commissionId: q.commissionId,
      link: `/portal/${q.commissionId}?quote=${q.id}`,
      mail: (p) => quoteExpiryMail({ ...p, title, version: q.version, validUntil: q.validUntil! }),
    });
  }

  for (const b of balancesFrom(accepted, paid)) {
    const deadline = b.quote['deadline'] as string | null;
    if (!b.depositPaid || b.balancePence <= 0 || !deadline || deadline < today || deadline > addDays(today, BALANCE_REMINDER_DAYS)) continue;
    const title = b.quote['title'] as string;
    out.push({
      kind: 'balance_due',
      subjectId: b.quote.commissionId,
      dueOn: deadline,
      commissionId: b.quote.commissionId,
      link: `/portal/${b.quote.commissionId}`,
      mail: (p) => balanceDueMail({ ...p, title, balancePence: b.balancePence, deadline }),
    });
  }

  // One reminder per commission for its garments listed more than N days ago and not arrived. Its key's
  // date is the day the first of them was listed, so changing N later does not send it again.
  const late = new Map<number, { title: string; names: string[]; dueOn: string }>();
  for (const g of expectedGarmentsFrom(garments, events)) {
    const listedOn = g.createdAt.toISOString().slice(0, 10);
    if (addDays(listedOn, settings.garmentsLateDays) > today) continue;
    const entry = late.get(g.commissionId) ?? { title: g['title'] as string, names: [], dueOn: listedOn };
    entry.names.push(g.description);
    if (listedOn < entry.dueOn) entry.dueOn = listedOn;
    late.set(g.commissionId, entry);
  }
  for (const [commissionId, g] of late) {
    out.push({
      kind: 'garments_late',
      subjectId: commissionId,
      dueOn: g.dueOn,
      commissionId,
      link: `/portal/${commissionId}`,
      mail: (p) => garmentsLateMail({ ...p, title: g.title, garments: g.names, days: settings.garmentsLateDays }),
    });
  }
  return out;
}

/**
 * Claims the reminder's key and queues its mail in one transaction: the
 * unique key (kind, subject, due date) lets exactly one sweep claim it, even
 * when two run at once or after a restart. A client without an e-mail
 * address is skipped without claiming, so the reminder goes once one is set.
 */
async function sendOnce(r: DueReminder, studioName: string, appUrl: string): Promise<boolean> {
  return ReminderSentModel.transaction(async (trx: Knex.Transaction) => {
    const commission = await CommissionModel.query(trx).findById(r.commissionId).withGraphFetched('client');
    const client = commission?.client;
    if (!client?.email) return false;
    if (r.kind === 'balance_due' && (await PaymentModel.query(trx).where({ commissionId: r.commissionId, kind: 'balance', status: 'held' }).first())) return false;
    const claimed: Array<{ id: number }> = await trx('remindersSent').insert({ kind: r.kind, subjectId: r.subjectId, dueOn: r.dueOn }).onConflict(['kind', 'subjectId', 'dueOn']).ignore().returning('id');
    if (!claimed.length) return false;
    const mail = r.mail({ clientName: client.name, studioName, link: `${appUrl.replace(/\/$/, '')}${r.link}` });
    const queued = await enqueueMail(trx, { kind: `reminder_${r.kind}`, to: client.email, ...mail, commissionId: r.commissionId });
    await ReminderSentModel.query(trx).patch({ outboxMailId: queued.id }).findById(claimed[0]!.id);
    return true;
  });
}

/** One sweep: every reminder due today that has not gone yet is queued. Answers how many were queued. */
export async function sweepReminders(appUrl: string, today = todayIs()): Promise<number> {
  const settings = await StudioSettingsModel.current();
  let queued = 0;
  for (const r of await dueReminders(settings, today)) if (await sendOnce(r, settings.studioName, appUrl)) queued++;
  return queued;
}

/**
 * Sweeps on start and then every few minutes, in the server's process; a
 * sweep still running when the next is due is not doubled. Mail queued is
 * handed to the outbox at once.
 */
export function startReminderSweeps(appUrl: string, kickMail: () => void, everyMs = 5 * 60_000) {
  let running = false;
  const run = async () => {
    if (running) return;
    running = true;
    try {
      if ((await sweepReminders(appUrl)) > 0) kickMail();
    } catch (err) {
      console.error('Reminders:', (err as Error).message);
    } finally {
      running = false;
    }
  };
  const firstSweep = run();
  const timer = setInterval(() => void run(), everyMs);
  timer.unref();
  return { firstSweep, stop: () => clearInterval(timer) };
}
