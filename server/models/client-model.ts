import { Model } from 'objection';

export class ClientModel extends Model {
  static override tableName = 'clients';

  id!: number;
  name!: string;
  email!: string | null;
  phone!: string | null;
  address!: string | null;
  notes!: string | null;
  portfolioConsent!: boolean;
  /** When the portal invitation was last sent (null: never). */
  invitationSentAt!: Date | null;
  createdAt!: Date;
  updatedAt!: Date;

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}
