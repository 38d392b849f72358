import { Model } from 'objection';

export interface StoredAttachment {
  filename: string;
  contentType: string;
  /** base64 of the file. */
  content: string;
}

export class OutboxMailModel extends Model {
  static override tableName = 'outboxMails';
  id!: number;
  kind!: string;
  toAddress!: string;
  subject!: string;
  textBody!: string;
  htmlBody!: string;
  attachments!: StoredAttachment[];
  commissionId!: number | null;
  status!: 'pending' | 'sent' | 'failed';
  attempts!: number;
  nextAttemptAt!: Date;
  lastError!: string | null;
  messageId!: string | null;
  sentAt!: Date | null;
  createdAt!: Date;

  static override get jsonAttributes() {
    return ['attachments'];
  }
}
