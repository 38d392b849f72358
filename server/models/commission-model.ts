import { Model, type QueryBuilder } from 'objection';
import type { AgeGroup, CommissionKind, Stage } from '@keepstitch/shared';
import { ClientModel } from './client-model';
import { DesignVersionModel } from './design-model';
import { GarmentModel } from './garment-model';
import { PaymentModel } from './payment-model';
import { PhotoModel } from './photo-model';
import { QuoteModel } from './quote-model';
import { UserModel } from './user-model';

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
  garments?: GarmentModel[];
  photos?: PhotoModel[];
  stageMoves?: StageMoveModel[];
  hours?: HoursModel[];
  quotes?: QuoteModel[];
  payments?: PaymentModel[];
  designVersions?: DesignVersionModel[];

  /**
   * What a commission holds. Its rows point at it; none of them points back
   * to the commission model (a garment, photo or quote is reached from here).
   */
  static override get relationMappings() {
    const hasMany = <M extends typeof Model>(modelClass: M, table: string, order: (q: QueryBuilder<InstanceType<M>>) => void) => ({
      relation: Model.HasManyRelation,
      modelClass,
      join: { from: 'commissions.id', to: `${table}.commissionId` },
      modify: order,
    });
    return {
      client: {
        relation: Model.BelongsToOneRelation,
        modelClass: ClientModel,
        join: { from: 'commissions.clientId', to: 'clients.id' },
      },
      /** In the order they were logged. */
      garments: hasMany(GarmentModel, 'garments', (q) => q.orderBy('garments.id')),
      /** Garment and progress photos, in the order they came. */
      photos: hasMany(PhotoModel, 'photos', (q) => q.orderBy('photos.id')),
      /** Its history of stages, oldest first. */
      stageMoves: hasMany(StageMoveModel, 'stageMoves', (q) => q.orderBy('stageMoves.movedAt').orderBy('stageMoves.id')),
      /** Hours worked, in the order worked. */
      hours: hasMany(HoursModel, 'hoursLogged', (q) => q.orderBy('hoursLogged.workedOn').orderBy('hoursLogged.id')),
      /** Every version of its quote, the newest first. */
      quotes: hasMany(QuoteModel, 'quotes', (q) => q.orderBy('quotes.version', 'desc')),
      payments: hasMany(PaymentModel, 'payments', (q) => q.orderBy('payments.id')),
      /** Every saved version of its design, the newest first. */
      designVersions: hasMany(DesignVersionModel, 'designVersions', (q) => q.orderBy('designVersions.version', 'desc')),
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
  user?: UserModel;

  static override get relationMappings() {
    return {
      /** Who logged them. */
      user: {
        relation: Model.BelongsToOneRelation,
        modelClass: UserModel,
        join: { from: 'hoursLogged.userId', to: 'users.id' },
      },
    };
  }
}
