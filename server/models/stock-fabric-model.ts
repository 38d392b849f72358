import { Model } from 'objection';
import type { Fibre } from '@keepstitch/shared';

export class StockFabricModel extends Model {
  static override tableName = 'stockFabrics';
  id!: number;
  name!: string;
  colour!: string | null;
  fibre!: Fibre;
  widthMm!: string;
  lengthMm!: string;
  costPence!: number | null;
  costUnit!: 'metre' | 'yard';
  supplier!: string | null;
  notes!: string | null;
  createdAt!: Date;
  updatedAt!: Date;

  override $beforeUpdate(): void {
    this.updatedAt = new Date();
  }
}
