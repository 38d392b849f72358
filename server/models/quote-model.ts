import { Model } from 'objection';
import type { VatMode, VatRate } from '@keepstitch/shared';

export type QuoteStatus = 'draft' | 'sent' | 'accepted' | 'declined' | 'superseded';
export type LineKind = 'material' | 'labour' | 'extra' | 'discount';

export class QuoteLineModel extends Model {
  static override tableName = 'quoteLines';
  id!: number;
  quoteId!: number;
  position!: number;
  kind!: LineKind;
  description!: string;
  quantity!: string;
  unit!: string;
  unitPricePence!: string;
  stage!: string | null;
}

export class QuoteModel extends Model {
  static override tableName = 'quotes';
  id!: number;
  commissionId!: number;
  version!: number;
  status!: QuoteStatus;
  intro!: string | null;
  validUntil!: string | null;
  depositPercent!: string;
  vatRate!: VatRate | null;
  vatMode!: VatMode;
  netPence!: number | null;
  vatPence!: number | null;
  totalPence!: number | null;
  depositPence!: number | null;
  studioSnapshot!: Record<string, unknown> | null;
  sentAt!: Date | null;
  acceptedAt!: Date | null;
  acceptedName!: string | null;
  declinedAt!: Date | null;
  declineNote!: string | null;
  createdBy!: number | null;
  createdAt!: Date;
  updatedAt!: Date;

  lines?: QuoteLineModel[];

  static override get jsonAttributes() {
    return ['studioSnapshot'];
  }

  static override get relationMappings() {
    return {
      lines: {
        relation: Model.HasManyRelation,
        modelClass: QuoteLineModel,
        join: { from: 'quotes.id', to: 'quoteLines.quoteId' },
        modify: (q: import('objection').QueryBuilder<QuoteLineModel>) => q.orderBy('position'),
      },
    };
  }

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}
