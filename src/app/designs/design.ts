import { UNKNOWN_FABRIC_COLOUR, fabricKey, groupLegendEntry, groupStripes, type DesignBody, type DesignDerivation, type DesignPlanSummary, type GarmentGroup } from '@keepstitch/shared';
import * as z from 'zod/mini';

const object = <T>() => z.custom<T>((v) => typeof v === 'object' && v !== null);
const date = z.nullable(z.string());

/** A fabric the design may name, with the colour the drawing uses. */
export const fabricSchema = z.object({
  key: z.string(),
  kind: z.enum(['garment', 'stock', 'group']),
  id: z.optional(z.nullable(z.number())),
  name: z.string(),
  colour: z.optional(z.nullable(z.string())),
  hex: z.string(),
  /** A group of garments: the stripes it is drawn in. */
  stripes: z.optional(z.array(z.string())),
  detail: z.optional(z.string()),
});
export type Fabric = z.infer<typeof fabricSchema>;

export const versionSchema = z.object({
  id: z.number(),
  version: z.number(),
  body: object<DesignBody>(),
  derived: object<DesignDerivation>(),
  plan: object<DesignPlanSummary>(),
  note: z.nullable(z.string()),
  createdAt: z.string(),
  sharedAt: date,
  clientResponse: z.nullable(z.enum(['approved', 'changes_requested'])),
  clientNote: z.nullable(z.string()),
  respondedAt: date,
});
export type DesignVersion = z.infer<typeof versionSchema>;

export const garmentSourceSchema = z.object({
  id: z.number(),
  description: z.string(),
  colour: z.nullable(z.string()),
  fibre: z.string(),
  print: z.string(),
  construction: z.string(),
  panels: z.array(
    z.object({
      id: z.number(),
      name: z.string(),
      widthMm: z.string(),
      heightMm: z.string(),
      grain: z.string(),
      /** Kept features measured on the panel: top-left corner and size, exact mm. */
      features: z.optional(z.array(z.object({ name: z.string(), xMm: z.string(), yMm: z.string(), widthMm: z.string(), heightMm: z.string() }))),
    }),
  ),
});
export type GarmentSource = z.infer<typeof garmentSourceSchema>;

export const stockSourceSchema = z.object({ id: z.number(), name: z.string(), colour: z.nullable(z.string()), fibre: z.string(), widthMm: z.string(), lengthMm: z.string() });
export type StockSource = z.infer<typeof stockSourceSchema>;

export const designScreenSchema = z.object({
  commission: z.object({
    id: z.number(),
    title: z.string(),
    kind: z.string(),
    ageGroup: z.string(),
    sizePreset: z.nullable(z.string()),
    widthMm: z.nullable(z.string()),
    lengthMm: z.nullable(z.string()),
    stage: z.string(),
  }),
  current: z.nullable(versionSchema),
  versions: z.array(
    z.object({ id: z.number(), version: z.number(), note: z.nullable(z.string()), createdAt: z.string(), sharedAt: date, clientResponse: z.nullable(z.string()), clientNote: z.nullable(z.string()), respondedAt: date }),
  ),
  fabrics: z.array(fabricSchema),
  garments: z.array(garmentSourceSchema),
  stock: z.array(stockSourceSchema),
});
export type DesignScreen = z.infer<typeof designScreenSchema>;

export const previewSchema = z.object({ derived: object<DesignDerivation>(), plan: object<DesignPlanSummary>(), fabrics: z.array(fabricSchema) });
export type DesignPreview = z.infer<typeof previewSchema>;

export const sharedDesignSchema = z.object({
  commission: z.object({ id: z.number(), title: z.string() }),
  version: z.number(),
  sharedAt: z.string(),
  body: object<DesignBody>(),
  derived: object<DesignDerivation>(),
  fabrics: z.array(z.object({ key: z.string(), kind: z.string(), name: z.string(), hex: z.string(), stripes: z.optional(z.array(z.string())) })),
  /** Where the kept features go in the top. */
  keptFeatures: z.optional(z.array(z.object({ position: z.number(), rail: z.nullable(z.number()), feature: z.string(), garment: z.string() }))),
  clientResponse: z.nullable(z.enum(['approved', 'changes_requested'])),
  clientNote: z.nullable(z.string()),
  respondedAt: date,
});
export type SharedDesign = z.infer<typeof sharedDesignSchema>;

/** The care card that goes with the finished piece (the client may read their own). */
export const careCardSchema = z.object({
  commission: z.object({ id: z.number(), title: z.string(), kind: z.string(), ageGroup: z.string() }),
  maker: z.string(),
  washing: z.array(z.string()),
  fibres: z.array(z.object({ fibre: z.string(), garments: z.array(z.string()), studio: z.array(z.string()) })),
  cautions: z.array(z.object({ code: z.string(), title: z.string(), text: z.string(), source: z.string() })),
  deferNote: z.string(),
});
export type CareCard = z.infer<typeof careCardSchema>;

/** A group as a fabric of the legend, as the server gives it: drawn in stripes of its garments' colours. */
export function groupFabric(group: GarmentGroup, legend: readonly Fabric[]): Fabric {
  const hex = new Map(legend.map((f) => [f.key, f.hex]));
  return { ...groupLegendEntry(group, (id) => hex.get(fabricKey({ kind: 'garment', garmentId: id }))), kind: 'group', id: null, colour: null };
}

/** The stripes a group is drawn in, from the drawing colours by fabric key. */
export function groupColours(group: Pick<GarmentGroup, 'garmentIds'>, colours: Readonly<Record<string, string | undefined>>): string[] {
  return groupStripes(group.garmentIds, (id) => colours[fabricKey({ kind: 'garment', garmentId: id })]);
}

/** A CSS background for a swatch: one colour, or diagonal stripes of a group's garments. */
export function swatchBackground(colours: readonly string[]): string {
  if (colours.length <= 1) return colours[0] ?? UNKNOWN_FABRIC_COLOUR;
  const stops = colours.map((c, i) => `${c} ${i * 6}px ${(i + 1) * 6}px`).join(', ');
  return `repeating-linear-gradient(45deg, ${stops})`;
}

/** A fabric's swatch background: its stripes when it has them, else its colour. */
export function swatchOf(fabric: Pick<Fabric, 'hex' | 'stripes'>): string {
  return fabric.stripes ? swatchBackground(fabric.stripes) : fabric.hex;
}

/** A design to start from: the commission's size, 12 in plain squares with 2 in sashing. */
export function starterDesign(widthMm: string | null, lengthMm: string | null): DesignBody {
  const w = Number(widthMm ?? 1524);
  const l = Number(lengthMm ?? 1828.8);
  const block = 304.8;
  const columns = Math.max(1, Math.floor((w + 50.8) / (block + 50.8)));
  const rows = Math.max(1, Math.floor((l + 50.8) / (block + 50.8)));
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: String(w), lengthMm: String(l) },
    layout: { setting: 'straight', rows, columns, blockMm: String(block), sashing: { widthMm: '50.8', cornerstones: true }, borders: [] },
    blocks: [{ id: 'A', name: 'Plain square', kind: 'square' }],
    pattern: ['A'],
    groups: [],
    assignments: [],
    finishing: { bindingStockId: null, bindingStripMm: '63.5', backingStockId: null, waddingStockId: null, prewash: true, shrinkPercent: '3' },
    rules: { minimumPerGarment: 0 },
  };
}
