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
  createdAt!: Date;
  updatedAt!: Date;

  /** Columns a workroom assistant may see: names only, no contact details. */
  static readonly workroomColumns = ['id', 'name'] as const;

  static override get modifiers() {
    return {
      /** Case-insensitive text search over name, e-mail and phone. */
      matching(query: import('objection').QueryBuilder<ClientModel>, text: string) {
        const like = `%${text.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
        query.where((q) => q.whereILike('name', like).orWhereILike('email', like).orWhereILike('phone', like));
      },
    };
  }

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}
