import Decimal from 'decimal.js';
import type { DesignBody, BlockKind } from '../design/design-body';
import { BLOCK_KIND_MODULES } from '../design/kinds';
import type { DesignDerivation } from '../design/derive-design';
import type { DesignPlanSummary } from '../design/plan-design';

/**
 * Lines for a first quote, drawn from a commission's design: the studio fabric
 * still to buy (from the shopping list, at the studio's price per metre or
 * yard), wadding when it is not from stock, thread, a label, fusible
 * stabiliser for knit garments (these at a price the maker fills in), and labour by stage estimated
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

const MM_PER: Record<'metre' | 'yard', Decimal> = { metre: new Decimal(1000), yard: new Decimal('914.4') };

export function suggestQuoteLines(input: SuggestionInput): SuggestedLine[] {
  const lines: SuggestedLine[] = [];

  for (const s of input.plan.shopping) {
    const buy = new Decimal(s.buyMm);
    if (buy.lte(0)) continue;
    const stock = input.stock.find((x) => x.id === s.stockId);
    const unit = stock?.costUnit ?? 'metre';
    const quantity = buy.dividedBy(MM_PER[unit]).toDecimalPlaces(4, Decimal.ROUND_UP);
    lines.push({
      kind: 'material',
      description: `${s.name} (${s.uses.join(', ') || 'studio fabric'})`,
      quantity: quantity.toString(),
      unit: unit === 'metre' ? 'm' : 'yd',
      unitPricePence: stock?.costPence ?? 0,
    });
  }

  if (input.plan.wadding.stockId === null) {
    const cm = (mm: string) => new Decimal(mm).dividedBy(10).toDecimalPlaces(0, Decimal.ROUND_UP).toString();
    lines.push({ kind: 'material', description: `Wadding, ${cm(input.plan.wadding.widthMm)} x ${cm(input.plan.wadding.lengthMm)} cm`, quantity: '1', unit: 'piece', unitPricePence: 0 });
  }
  lines.push({ kind: 'material', description: 'Thread for piecing and quilting', quantity: '1', unit: 'lot', unitPricePence: 0 });
  lines.push({ kind: 'extra', description: 'Sewn-in label', quantity: '1', unit: 'item', unitPricePence: 0 });

  if (input.knitGarments > 0) {
    lines.push({
      kind: 'material',
      description: `Fusible stabiliser for ${input.knitGarments} knit garment${input.knitGarments === 1 ? '' : 's'}`,
      quantity: String(input.knitGarments),
      unit: 'garments',
      unitPricePence: 0,
    });
  }

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
    ['preparation', `Preparing ${input.garments} garment${input.garments === 1 ? '' : 's'}: unpicking, washing, pressing${input.knitGarments ? ', stabilising' : ''}`, new Decimal(ESTIMATES.preparationHoursPerGarment).times(input.garments)],
    ['cutting', `Cutting ${pieces} pieces`, new Decimal(ESTIMATES.cuttingMinutesPerPiece).times(pieces).dividedBy(60)],
    ['piecing', `Piecing ${input.derived.totals.blocks} blocks and the top`, pieceMinutes.dividedBy(60)],
    ['quilting', `Quilting (${areaSqM.toDecimalPlaces(2).toString()} m\u00b2)`, areaSqM.times(ESTIMATES.quiltingHoursPerSqM)],
    ['binding', `Binding and label (${perimeterM.toDecimalPlaces(1).toString()} m of edge)`, perimeterM.times(ESTIMATES.bindingHoursPerM)],
  ];
  for (const [stage, description, hours] of labour) {
    if (hours.lte(0)) continue;
    lines.push({ kind: 'labour', description, quantity: quarterHours(hours), unit: 'hours', unitPricePence: rate, stage });
  }
  return lines;
}
