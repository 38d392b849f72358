import { Model, type QueryBuilder } from 'objection';
import type { AgeGroup, CommissionKind, Stage } from '@keepstitch/shared';
import { ClientModel } from './client-model';

export class CommissionModel extends Model {
  static override tableName = 'commissions';

  id!: number;
  clientId!: number;
  title!: string;
  kind!: CommissionKind;
  recipient!: string | null;
  ageGroup!: AgeGroup;
  occasion!: string | null;
  sizePreset!: string | null;
  widthMm!: string | null;
  lengthMm!: string | null;
  deadline!: string | null;
  budgetPence!: number | null;
  notes!: string | null;
  stage!: Stage;
  createdAt!: Date;
  updatedAt!: Date;

  client?: ClientModel;

  static override get relationMappings() {
    return {
      client: {
        relation: Model.BelongsToOneRelation,
        modelClass: ClientModel,
        join: { from: 'commissions.clientId', to: 'clients.id' },
      },
    };
  }

  static override get modifiers() {
    return {
      /** Only the commissions this user may see. */
      visibleTo(query: QueryBuilder<CommissionModel>, user: Express.User) {
        if (user.role === 'client') query.where('commissions.clientId', user.clientId ?? -1);
      },
    };
  }

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}

export class StageMoveModel extends Model {
  static override tableName = 'stageMoves';
  id!: number;
  commissionId!: number;
  fromStage!: Stage | null;
  toStage!: Stage;
  note!: string | null;
  movedBy!: number | null;
  movedAt!: Date;
}

export class HoursModel extends Model {
  static override tableName = 'hoursLogged';
  id!: number;
  commissionId!: number;
  stage!: Stage;
  hours!: string;
  workedOn!: string;
  note!: string | null;
  userId!: number | null;
  createdAt!: Date;
}
