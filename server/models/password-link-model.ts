import { Model } from 'objection';

export type PasswordLinkPurpose = 'invitation' | 'reset';

/** A one-time link to set a password; only the SHA-256 of its token is stored. */
export class PasswordLinkModel extends Model {
  static override tableName = 'passwordLinks';
  id!: number;
  userId!: number;
  purpose!: PasswordLinkPurpose;
  tokenHash!: string;
  expiresAt!: Date;
  usedAt!: Date | null;
  createdAt!: Date;
}
