import { Model } from 'objection';

export const REMINDER_KINDS = ['quote_expiry', 'balance_due', 'garments_late'] as const;
export type ReminderKind = (typeof REMINDER_KINDS)[number];

/**
 * A reminder that has been put in the outbox. Its kind, subject (a quote,
 * a commission) and due date are unique together, so it is sent once.
 */
export class ReminderSentModel extends Model {
  static override tableName = 'remindersSent';
  id!: number;
  kind!: ReminderKind;
  subjectId!: number;
  dueOn!: string;
  outboxMailId!: number | null;
  createdAt!: Date;
}
