import { BLOCK_KIND_MODULES, STUDIO_LOCALES, type BlockKind } from '@keepstitch/shared';
import * as z from 'zod/mini';

/** The block kinds whose sewing time the studio estimates, in the registry's order, with the settings page's name for each. */
export const BLOCK_KINDS = BLOCK_KIND_MODULES.map((k) => k.kind);
export type { BlockKind };

export const BLOCK_KIND_LABELS = Object.fromEntries(BLOCK_KIND_MODULES.map((k) => [k.kind, k.labour.label])) as Readonly<Record<BlockKind, string>>;

export const VAT_RATE_LABELS: Readonly<Record<'20' | '5' | '0', string>> = {
  '20': '20% (standard)',
  '5': '5% (reduced)',
  '0': '0% (zero rate)',
};

const vatRate = z.enum(['20', '5', '0']);
const vatMode = z.enum(['line', 'invoice']);

export const studioSettingsSchema = z.object({
  studioName: z.string(),
  makerName: z.string(),
  address: z.string(),
  email: z.nullable(z.string()),
  hourlyRatePence: z.number(),
  vatRegistered: z.boolean(),
  vatRate,
  vatMode,
  vatNumber: z.nullable(z.string()),
  depositPercent: z.union([z.string(), z.number()]),
  validityDays: z.number(),
  paymentTerms: z.string(),
  blockMinutes: z.record(z.string(), z.number()),
  remindQuoteExpiry: z.boolean(),
  remindBalanceDue: z.boolean(),
  remindGarmentsLate: z.boolean(),
  garmentsLateDays: z.number(),
  /** When the calendar feed's address was made; null when there is no feed. */
  calendarFeedMadeAt: z.nullable(z.string()),
  locale: z.enum(STUDIO_LOCALES),
});
export type StudioSettings = z.infer<typeof studioSettingsSchema>;

/** What the settings page sends: any part of the settings, the deposit as a number. */
export type StudioSettingsPatch = Partial<Omit<StudioSettings, 'depositPercent' | 'calendarFeedMadeAt'> & { depositPercent: number }>;

export const calendarFeedSchema = z.object({ url: z.string(), madeAt: z.string() });
export type CalendarFeed = z.infer<typeof calendarFeedSchema>;
