import { Model } from 'objection';
import type { Role } from '../core/roles';
import { ClientModel } from './client-model';

export class UserModel extends Model {
  static override tableName = 'users';

  id!: number;
  email!: string;
  name!: string;
  role!: Role;
  clientId!: number | null;
  passwordHash!: string;
  passwordChangedAt!: Date;
  /** Made by an invitation and its link not used yet: no password of its own. */
  awaitingPassword!: boolean;
  createdAt!: Date;
  updatedAt!: Date;

  client?: ClientModel;

  static override get relationMappings() {
    return {
      client: {
        relation: Model.BelongsToOneRelation,
        modelClass: ClientModel,
        join: { from: 'users.clientId', to: 'clients.id' },
      },
    };
  }

  /** What the API shows of a user: never the hash. */
  toPublic(): PublicUser {
    return { id: this.id, email: this.email, name: this.name, role: this.role, clientId: this.clientId };
  }

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}

export interface PublicUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  clientId: number | null;
}
