import { FIBRE, Fibre } from '@keepstitch/shared';
import * as z from 'zod/mini';

const text = z.optional(z.nullable(z.string()));

/** A studio fabric on the shelf. Cost fields reach the owner only. */
export const stockItemSchema = z.object({
  id: z.number(),
  name: z.string(),
  colour: text,
  fibre: z.optional(z.nullable(z.enum(FIBRE.values))),
  widthMm: z.string(),
  lengthMm: z.string(),
  costPence: z.optional(z.nullable(z.number())),
  costUnit: z.optional(z.nullable(z.enum(['metre', 'yard']))),
  supplier: text,
  notes: text,
});
export type StockItem = z.infer<typeof stockItemSchema>;

export const stockListSchema = z.object({ items: z.array(stockItemSchema) });

export interface StockDraft {
  name: string;
  colour: string | null;
  fibre: Fibre | null;
  width?: string;
  length?: string;
  unit?: 'in' | 'cm' | 'm' | 'yd';
  costPence: number | null;
  costUnit: 'metre' | 'yard' | null;
  supplier: string | null;
  notes: string | null;
}
