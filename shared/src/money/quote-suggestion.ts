import Decimal from 'decimal.js';
import type { DesignBody, BlockKind } from '../design/design-body';
import { BLOCK_KIND_MODULES } from '../design/kinds';
import type { DesignDerivation } from '../design/derive-design';
import type { DesignPlanSummary } from '../design/plan-design';
import { plural } from '../design/kinds/block-kind';
import { Length } from '../measure';
import { lengthBeforeShrinking } from '../shrinkage';
import { priceLength } from './material-pricing';

/**
 * Lines for a first quote, drawn from a commission's design: every studio
 * fabric the plan uses (pieces, borders, backing, binding, wadding from a
 * roll), whether on hand or to buy, at its stock cost per metre or yard in the
 * shop's steps (material-pricing.ts); what has no cost kept anywhere (thread,
 * a label, stabiliser, a fabric without a cost) is left out with a note
 * rather than shown as free; and labour by stage estimated
 * from the studio's minutes per block kind and from the size of the piece.
 * Every line is a suggestion the maker edits before sending.
 */
export interface SuggestionStock {
  id: number;
  name: string;
  costPence: number | null;
  costUnit: 'metre' | 'yard';
}

export interface SuggestionInput {
  body: DesignBody;
  derived: DesignDerivation;
  plan: DesignPlanSummary;
  stock: readonly SuggestionStock[];
  hourlyRatePence: number;
  /** Minutes to piece one block of each kind, by block kind (square, rectangles, hst, qst, flying-geese, foundation, plate, fan). */
  blockMinutes: Readonly<Record<string, number>>;
  /** Garments of the commission that are knits (they need a fusible stabiliser). */
  knitGarments: number;
  garments: number;
}

export interface SuggestedLine {
  kind: 'material' | 'labour' | 'extra';
  description: string;
  quantity: string;
  unit: string;
  unitPricePence: number;
  stage?: 'preparation' | 'cutting' | 'piecing' | 'quilting' | 'binding';
}

/** Minutes used when the studio has not set its own for a block kind (each kind's labour minutes: common practice, from memory: rough). */
export const DEFAULT_BLOCK_MINUTES: Readonly<Record<BlockKind, number>> = Object.fromEntries(BLOCK_KIND_MODULES.map((k) => [k.kind, k.labour.minutes])) as Record<BlockKind, number>;

/** Size-based estimates (common practice, rough; the maker edits them): hours per square metre of quilting, per metre of binding, per garment prepared, per piece cut. */
export const ESTIMATES = { quiltingHoursPerSqM: 1.5, bindingHoursPerM: 0.2, preparationHoursPerGarment: 0.75, cuttingMinutesPerPiece: 1 } as const;

/** Hours rounded up to the next quarter, never below a quarter. */
export function quarterHours(hours: Decimal.Value): string {
  const q = new Decimal(hours).times(4).ceil().dividedBy(4);
  return Decimal.max(q, 0.25).toFixed(2);
}

/** A suggested quote: its lines, and what was left out and why (a cost the studio keeps nowhere is not shown as free). */
export interface QuoteSuggestion {
  lines: SuggestedLine[];
  notes: string[];
}

const cm = (mm: Decimal.Value) => new Decimal(mm).dividedBy(10).toDecimalPlaces(0, Decimal.ROUND_UP).toString();

/** Each studio fabric the plan uses (pieces, borders, backing, binding, wadding), at its stock cost in shop steps. */
function materialLines(input: SuggestionInput, notes: string[]): SuggestedLine[] {
  const lines: SuggestedLine[] = [];
  const f = input.body.finishing;
  for (const s of input.plan.shopping) {
    let used = Length.millimetres(s.needMm);
    if (!used.isPositive()) continue;
    // Studio fabric pre-washed for this piece shrinks: the length cut from the bolt is the one grown for it.
    if (f.prewash && Number(f.shrinkPercent) > 0) used = lengthBeforeShrinking(used, f.shrinkPercent);
    const stock = input.stock.find((x) => x.id === s.stockId);
    const priced = priceLength(used, { costPence: stock?.costPence ?? null, costUnit: stock?.costUnit ?? 'metre' });
    if (!priced) continue;
    if (priced.unitPricePence === null) {
      notes.push(`${s.name} is not priced: Studio fabric holds no cost for it. Add its cost there, or add a line for ${priced.quantity} ${priced.unit}.`);
      continue;
    }
    lines.push({
      kind: 'material',
      description: `${s.name} (${s.uses.join(', ') || 'studio fabric'}), cut in ${priced.increment} steps`,
      quantity: priced.quantity,
      unit: priced.unit,
      unitPricePence: priced.unitPricePence,
    });
  }
  const plan = input.plan;
  if (plan.backing.stockId === null) notes.push(`No backing fabric is chosen (${cm(plan.backing.widthMm)} x ${cm(plan.backing.lengthMm)} cm is needed): choose one from Studio fabric in the design's finishing to price it, or add a line.`);
  if (plan.binding.stockId === null) notes.push(`No binding fabric is chosen (${plural(plan.binding.strips, 'strip')} ${plan.binding.strips === 1 ? 'is' : 'are'} needed): choose one from Studio fabric in the design's finishing to price it, or add a line.`);
  if (plan.wadding.stockId === null) notes.push(`The wadding (${cm(plan.wadding.widthMm)} x ${cm(plan.wadding.lengthMm)} cm) is not from Studio fabric: choose it in the design's finishing to price it, or add a line.`);
  const unpriced = ['thread', 'a sewn-in label', ...(input.knitGarments > 0 ? [`fusible stabiliser for ${plural(input.knitGarments, 'knit garment')}`] : [])];
  notes.push(`Not priced: ${unpriced.join(', ')}. The studio keeps no cost for ${unpriced.length === 1 ? 'it' : 'them'}; add a line if you charge for ${unpriced.length === 1 ? 'it' : 'them'}.`);
  return lines;
}

export function suggestQuote(input: SuggestionInput): QuoteSuggestion {
  const notes: string[] = [];
  const lines = materialLines(input, notes);

  const rate = input.hourlyRatePence;
  const minutesFor = (kind: BlockKind) => input.blockMinutes[kind] ?? DEFAULT_BLOCK_MINUTES[kind] ?? 10;
  const blocks = new Map(input.body.blocks.map((b) => [b.id, b]));
  let pieceMinutes = new Decimal(0);
  for (const p of input.derived.positions) {
    const block = blocks.get(p.blockId);
    if (block) pieceMinutes = pieceMinutes.plus(minutesFor(block.kind));
  }
  const pieces = input.derived.pieces.reduce((n, p) => n + p.count, 0);
  const areaSqM = new Decimal(input.derived.finished.widthMm).times(input.derived.finished.lengthMm).dividedBy(1_000_000);
  const perimeterM = new Decimal(input.derived.finished.widthMm).plus(input.derived.finished.lengthMm).times(2).dividedBy(1000);

  const labour: Array<[SuggestedLine['stage'], string, Decimal]> = [
    ['preparation', `Preparing ${plural(input.garments, 'garment')}: unpicking, washing, pressing${input.knitGarments ? ', stabilising' : ''}`, new Decimal(ESTIMATES.preparationHoursPerGarment).times(input.garments)],
    ['cutting', `Cutting ${plural(pieces, 'piece')}`, new Decimal(ESTIMATES.cuttingMinutesPerPiece).times(pieces).dividedBy(60)],
    ['piecing', `Piecing ${plural(input.derived.totals.blocks, 'block')} and the top`, pieceMinutes.dividedBy(60)],
    ['quilting', `Quilting (${areaSqM.toDecimalPlaces(2).toString()} m\u00b2)`, areaSqM.times(ESTIMATES.quiltingHoursPerSqM)],
    ['binding', `Binding and label (${perimeterM.toDecimalPlaces(1).toString()} m of edge)`, perimeterM.times(ESTIMATES.bindingHoursPerM)],
  ];
  for (const [stage, description, hours] of labour) {
    if (hours.lte(0)) continue;
    lines.push({ kind: 'labour', description, quantity: quarterHours(hours), unit: 'hours', unitPricePence: rate, stage });
  }
  return { lines, notes };
}
