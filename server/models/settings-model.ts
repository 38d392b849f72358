import type { Knex } from 'knex';
import { Model } from 'objection';
import type { StudioLocale, VatMode, VatRate } from '@keepstitch/shared';

export class StudioSettingsModel extends Model {
  static override tableName = 'studioSettings';
  id!: number;
  studioName!: string;
  makerName!: string;
  address!: string;
  email!: string | null;
  hourlyRatePence!: number;
  vatRegistered!: boolean;
  vatRate!: VatRate;
  vatMode!: VatMode;
  vatNumber!: string | null;
  depositPercent!: string;
  validityDays!: number;
  paymentTerms!: string;
  blockMinutes!: Record<string, number>;
  /** The order dates are typed in on the forms (and later how numbers are written). */
  locale!: StudioLocale;
  updatedAt!: Date;

  static override get jsonAttributes() {
    return ['blockMinutes'];
  }

  /** The one settings row, read in the transaction given (or on its own). */
  static async current(trx?: Knex.Transaction): Promise<StudioSettingsModel> {
    const row = await StudioSettingsModel.query(trx).findById(1);
    if (!row) throw new Error('studio_settings has no row: run the migrations.');
    return row;
  }
}
