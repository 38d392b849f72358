import {
  AGE_GROUP,
  AgeGroup,
  ALL_STAGES,
  COLOUR_RUN,
  COMMISSION_KIND,
  CommissionKind,
  CONSTRUCTION,
  CUSTODY_KINDS,
  ColourRun,
  Construction,
  CustodyKind,
  FEATURE,
  FIBRE,
  Fibre,
  GARMENT_STATUSES,
  GRAIN,
  GarmentStatus,
  Grain,
  LengthUnit,
  PREWASH,
  PRINT,
  Prewash,
  Print,
  RETURN_METHODS,
  ReturnMethod,
  Stage,
} from '@keepstitch/shared';
import * as z from 'zod/mini';

import { photoSchema } from '../ui/photo';

const stage = z.enum(ALL_STAGES);
/** One of a vocabulary's stored values, or none. */
const maybe = <T extends string>(values: readonly [T, ...T[]]) => z.optional(z.nullable(z.enum(values)));
const text = z.optional(z.nullable(z.string()));

/** A row of the commission list (and the head of a commission page). */
export const commissionSchema = z.object({
  id: z.number(),
  clientId: z.number(),
  client: z.optional(z.nullable(z.object({ id: z.number(), name: z.string() }))),
  title: z.string(),
  kind: z.enum(COMMISSION_KIND.values),
  recipient: text,
  ageGroup: z.enum(AGE_GROUP.values),
  occasion: text,
  sizePreset: text,
  widthMm: text,
  lengthMm: text,
  deadline: text,
  daysLeft: z.optional(z.nullable(z.number())),
  overdue: z.optional(z.boolean()),
  stage,
  notes: text,
  budgetPence: z.optional(z.nullable(z.number())),
  createdAt: z.string(),
  updatedAt: z.optional(z.string()),
});
export type Commission = z.infer<typeof commissionSchema>;

export const commissionPageSchema = z.object({ items: z.array(commissionSchema), total: z.number() });
export type CommissionPage = z.infer<typeof commissionPageSchema>;

const featureSchema = z.object({ kind: z.enum(FEATURE.values), position: z.string() });
export type Feature = z.infer<typeof featureSchema>;

/** A kept feature on a panel: its top-left corner from the panel's top-left, and its size, exact mm. */
export const panelFeatureSchema = z.object({
  name: z.string(),
  xMm: z.string(),
  yMm: z.string(),
  widthMm: z.string(),
  heightMm: z.string(),
});
export type PanelFeature = z.infer<typeof panelFeatureSchema>;

export const panelSchema = z.object({
  id: z.number(),
  name: z.string(),
  widthMm: z.string(),
  heightMm: z.string(),
  grain: maybe(GRAIN.values),
  features: z.optional(z.array(panelFeatureSchema)),
});
export type Panel = z.infer<typeof panelSchema>;

export const garmentSchema = z.object({
  id: z.number(),
  commissionId: z.optional(z.number()),
  description: z.string(),
  whose: text,
  story: text,
  fibre: maybe(FIBRE.values),
  construction: maybe(CONSTRUCTION.values),
  colour: text,
  print: maybe(PRINT.values),
  features: z.optional(z.nullable(z.array(featureSchema))),
  status: z.optional(z.enum(GARMENT_STATUSES)),
  received: z.optional(z.boolean()),
  washed: z.optional(z.boolean()),
  place: text,
  removeForSafety: z.optional(z.array(featureSchema)),
  panels: z.optional(z.array(panelSchema)),
  photos: z.optional(z.array(photoSchema)),
  condition: text,
  prewash: maybe(PREWASH.values),
  colourRun: maybe(COLOUR_RUN.values),
  returnsToClient: text,
});
export type Garment = z.infer<typeof garmentSchema>;

export const custodyEventSchema = z.object({
  id: z.number(),
  kind: z.enum(CUSTODY_KINDS),
  at: z.string(),
  place: text,
  returnMethod: maybe(RETURN_METHODS),
  trackingRef: text,
  note: text,
  correctsEventId: z.optional(z.nullable(z.number())),
});
export type CustodyEventRow = z.infer<typeof custodyEventSchema>;

export const garmentDetailSchema = z.extend(garmentSchema, {
  events: z.optional(z.array(custodyEventSchema)),
});
export type GarmentDetail = z.infer<typeof garmentDetailSchema>;

export const eventReplySchema = z.object({
  event: custodyEventSchema,
  state: z.object({ status: z.custom<GarmentStatus>((v) => typeof v === 'string'), received: z.boolean(), washed: z.boolean(), place: z.nullable(z.string()) }),
});

/** A stage the commission might move to: allowed, or refused with the reason. */
const stageOptionSchema = z.object({ stage, allowed: z.boolean(), reason: z.optional(z.string()) });
export type StageChoice = z.infer<typeof stageOptionSchema>;

const hoursEntrySchema = z.object({
  id: z.number(),
  stage,
  hours: z.union([z.string(), z.number()]),
  workedOn: z.string(),
  note: text,
  userName: text,
});
export type HoursEntry = z.infer<typeof hoursEntrySchema>;

const stageComparison = z.object({
  stage: z.nullable(z.string()),
  quotedHours: z.string(),
  loggedHours: z.string(),
  differenceHours: z.string(),
  quotedPence: z.number(),
  loggedCostPence: z.number(),
  marginPence: z.number(),
});

export const commissionDetailSchema = z.extend(commissionSchema, {
  cautions: z.array(z.object({ code: z.string(), title: z.string(), text: z.string(), source: z.string() })),
  garments: z.array(garmentSchema),
  progressPhotos: z.array(photoSchema),
  stageHistory: z.array(
    z.object({ id: z.number(), fromStage: z.nullable(stage), toStage: stage, note: text, movedAt: z.string() }),
  ),
  hours: z.optional(
    z.object({ entries: z.array(hoursEntrySchema), byStage: z.record(z.string(), z.string()), total: z.string() }),
  ),
  /** The owner's only: quoted against logged hours per stage, and the labour margin. */
  hoursCompared: z.optional(z.nullable(z.object({ quoteId: z.number(), quoteVersion: z.number(), quoteStatus: z.string(), hourlyRatePence: z.number(), stages: z.array(stageComparison), total: z.omit(stageComparison, { stage: true }) }))),
  nextStages: z.optional(z.array(stage)),
  stageOptions: z.optional(z.array(stageOptionSchema)),
  facts: z.object({ garmentCount: z.number(), garmentsReceived: z.number(), openCustody: z.optional(z.array(z.string())) }),
});
export type CommissionDetail = z.infer<typeof commissionDetailSchema>;

export const stageReplySchema = z.object({ id: z.number(), stage, nextStages: z.optional(z.array(stage)), stageOptions: z.optional(z.array(stageOptionSchema)) });
export type StageReply = z.infer<typeof stageReplySchema>;

export type CommissionSortField = 'deadline' | 'createdAt' | 'title' | 'stage';

export interface CommissionQuery {
  page: number;
  pageSize: number;
  sort: CommissionSortField;
  dir: 'asc' | 'desc';
  stages: readonly Stage[];
  q: string;
  dueWithinDays: number | null;
  clientId: number | null;
}

export interface CommissionDraft {
  clientId: number;
  title: string;
  kind: CommissionKind;
  recipient: string | null;
  ageGroup: AgeGroup;
  occasion: string | null;
  sizePreset?: string | null;
  width?: string;
  length?: string;
  unit?: LengthUnit;
  deadline: string | null;
  budgetPence: number | null;
  notes: string | null;
}

/** What an edit may change: never the client; a size goes as typed, with its unit. */
export type CommissionChanges = Partial<
  Omit<CommissionDraft, 'clientId' | 'width' | 'length'> & { width: string | null; length: string | null }
>;

export interface GarmentDraft {
  description: string;
  whose?: string | null;
  story?: string | null;
  fibre?: Fibre | null;
  construction?: Construction | null;
  colour?: string | null;
  print?: Print | null;
  condition?: string | null;
  features?: Feature[];
  prewash?: Prewash | null;
  colourRun?: ColourRun | null;
  returnsToClient?: string | null;
}

export type CustodyEventDraft =
  | { kind: 'received'; place?: string; note?: string }
  | { kind: 'washed'; note?: string }
  | { kind: 'stored'; place: string; note?: string }
  | { kind: 'moved'; place: string; note?: string }
  | { kind: 'cut'; note?: string }
  | { kind: 'used'; note?: string }
  | { kind: 'returned'; returnMethod: ReturnMethod; trackingRef?: string; note?: string }
  | { kind: 'leftovers_returned'; returnMethod: ReturnMethod; trackingRef?: string; note?: string }
  | { kind: 'withdrawn'; note?: string }
  | { kind: 'correction'; correctsEventId: number; note: string };

/** A kept feature as typed: lengths as text, read in the panel draft's unit. */
export interface PanelFeatureDraft {
  name: string;
  x: string;
  y: string;
  width: string;
  height: string;
}

export interface PanelDraft {
  name: string;
  width: string;
  height: string;
  unit: LengthUnit;
  grain: Grain | null;
  /** The whole list: an edit replaces the panel's kept features with these. */
  features?: PanelFeatureDraft[];
}

/** Empty text becomes null, so the server stores "not given" rather than "". */
export function orNull(value: string | null | undefined): string | null {
  const trimmed = (value ?? '').trim();
  return trimmed === '' ? null : trimmed;
}

/** Days left in plain words: "12 days left", "due today", "3 days overdue". */
export function daysLeftText(row: Pick<Commission, 'deadline' | 'daysLeft' | 'overdue'>): string {
  if (!row.deadline || row.daysLeft === null || row.daysLeft === undefined) return '';
  const d = row.daysLeft;
  if (d === 0) return 'due today';
  if (d < 0 || row.overdue) {
    const late = Math.abs(d);
    return `overdue by ${late} day${late === 1 ? '' : 's'}`;
  }
  return `${d} day${d === 1 ? '' : 's'} left`;
}
