import type { Knex } from 'knex';
import type { Transporter } from 'nodemailer';
import { OutboxMailModel, type StoredAttachment } from '../models/outbox-model';

export interface NewMail {
  kind: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  commissionId?: number | null;
  attachments?: Array<{ filename: string; contentType: string; content: Buffer }>;
}

/** After this many failed attempts a mail is shown as failed (it is still kept and can be retried). */
export const MAX_ATTEMPTS = 12;

/** Waits 30 s after the first failure, doubling each time, at most an hour. */
export function retryDelayMs(attempts: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 3_600_000);
}

/**
 * Puts a mail in the outbox inside the caller's transaction, so it exists
 * exactly when the change that caused it does. Delivery happens afterwards.
 */
export async function enqueueMail(trx: Knex.Transaction, mail: NewMail): Promise<OutboxMailModel> {
  const attachments: StoredAttachment[] = (mail.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content.toString('base64') }));
  return OutboxMailModel.query(trx).insertAndFetch({
    kind: mail.kind,
    toAddress: mail.to,
    subject: mail.subject,
    textBody: mail.text,
    htmlBody: mail.html,
    attachments,
    commissionId: mail.commissionId ?? null,
  });
}

/**
 * Sends every mail that is due, one at a time, each under a row lock so two
 * workers never send the same mail. A failure is recorded and retried later
 * with a growing delay; nothing is dropped.
 */
export async function deliverDue(knex: Knex, transport: Transporter, from: string, now = new Date()): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (;;) {
    const outcome = await knex.transaction(async (trx) => {
      const mail = await OutboxMailModel.query(trx)
        .where('status', 'pending')
        .where('nextAttemptAt', '<=', now)
        .orderBy('id')
        .forUpdate()
        .skipLocked()
        .first();
      if (!mail) return 'none' as const;
      const messageId = `<outbox-${mail.id}@keepstitch.local>`;
      try {
        await transport.sendMail({
          from,
          to: mail.toAddress,
          subject: mail.subject,
          text: mail.textBody,
          html: mail.htmlBody,
          messageId,
          attachments: mail.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.content, 'base64') })),
        });
      } catch (err) {
        const attempts = mail.attempts + 1;
        await OutboxMailModel.query(trx)
          .patch({
            attempts,
            lastError: (err as Error).message.slice(0, 500),
            nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)),
            status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
          })
          .findById(mail.id);
        return 'failed' as const;
      }
      await OutboxMailModel.query(trx).patch({ status: 'sent', sentAt: new Date(), attempts: mail.attempts + 1, messageId, lastError: null }).findById(mail.id);
      return 'sent' as const;
    });
    if (outcome === 'none') break;
    if (outcome === 'sent') sent++;
    else {
      failed++;
      // The mail server is not answering: try the rest later rather than hammer it now.
      break;
    }
  }
  return { sent, failed };
}

/** Mails not yet delivered, for the owner to see. */
export function undelivered() {
  return OutboxMailModel.query()
    .select('id', 'kind', 'toAddress', 'subject', 'status', 'attempts', 'lastError', 'nextAttemptAt', 'createdAt', 'commissionId')
    .whereIn('status', ['pending', 'failed'])
    .orderBy('id');
}

/** Puts a failed mail back in line now. */
export async function retryMail(id: number): Promise<boolean> {
  const n = await OutboxMailModel.query().patch({ status: 'pending', nextAttemptAt: new Date() }).where('id', id).whereIn('status', ['pending', 'failed']);
  return n > 0;
}
