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
  /** Reminder switches (on by default) and how many days a garment may be awaited before the client is reminded. */
  remindQuoteExpiry!: boolean;
  remindBalanceDue!: boolean;
  remindGarmentsLate!: boolean;
  garmentsLateDays!: number;
  /** SHA-256 (hex) of the calendar feed's secret; null when there is no feed. Never sent. */
  calendarFeedHash!: string | null;
  calendarFeedMadeAt!: Date | null;
  /** The order dates are typed in on the forms (and later how numbers are written). */
  locale!: StudioLocale;
  updatedAt!: Date;

  static override get jsonAttributes() {
    return ['blockMinutes'];
  }

  /** The feed's secret stays on the server: the JSON says only whether there is a feed and since when. */
  override $formatJson(json: Record<string, unknown>) {
    const out = super.$formatJson(json);
    delete out['calendarFeedHash'];
    return out;
  }

  /** The one settings row, read in the transaction given (or on its own). */
  static async current(trx?: Knex.Transaction): Promise<StudioSettingsModel> {
    const row = await StudioSettingsModel.query(trx).findById(1);
    if (!row) throw new Error('studio_settings has no row: run the migrations.');
    return row;
  }
}
