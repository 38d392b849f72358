import * as z from 'zod/mini';

/** The block kinds whose sewing time the studio estimates, in the order the settings page lists them. */
export const BLOCK_KINDS = ['square', 'rectangle', 'hst', 'qst', 'flying_geese', 'foundation', 'plate', 'fan'] as const;
export type BlockKind = (typeof BLOCK_KINDS)[number];

export const BLOCK_KIND_LABELS: Readonly<Record<BlockKind, string>> = {
  square: 'Plain square',
  rectangle: 'Rectangle',
  hst: 'Half-square triangle (HST)',
  qst: 'Quarter-square triangle (QST)',
  flying_geese: 'Flying geese',
  foundation: 'Foundation (stitch and flip)',
  plate: 'Plate',
  fan: 'Fan',
};

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
});
export type StudioSettings = z.infer<typeof studioSettingsSchema>;

/** What the settings page sends: any part of the settings, the deposit as a number. */
export type StudioSettingsPatch = Partial<Omit<StudioSettings, 'depositPercent'> & { depositPercent: number }>;
