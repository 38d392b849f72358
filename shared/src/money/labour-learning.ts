import Decimal from 'decimal.js';
import type { DesignBody } from '../design/design-body';
import type { DesignDerivation } from '../design/derive-design';
import { BLOCK_KIND_LABELS, type BlockKind } from '../design/kinds';
import { plural } from '../design/kinds/block-kind';
import { STAGES } from '../workflow/commission-stages';
import { quarterHours } from './quote-suggestion';

/**
 * Quoted against logged: what the quote's labour lines assumed for each stage
 * next to the hours logged on it, and what the labour earned once the hours
 * are paid at the studio's rate. From finished commissions, the labour
 * estimate of the next quote learns how far logged hours ran from quoted ones.
 */

export interface QuotedLabourLine {
  /** The stage the line prices; null for a labour line given no stage. */
  stage: string | null;
  quantity: Decimal.Value;
  unitPricePence: Decimal.Value;
}

export interface LoggedHours {
  stage: string;
  hours: Decimal.Value;
}

export interface StageComparison {
  /** Null: labour lines that name no stage. */
  stage: string | null;
  quotedHours: string;
  loggedHours: string;
  /** Logged minus quoted: above zero when the work took longer than quoted. */
  differenceHours: string;
  /** What the quote charges for this stage's labour, in whole pence. */
  quotedPence: number;
  /** The logged hours at the hourly rate, in whole pence. */
  loggedCostPence: number;
  /** quotedPence minus loggedCostPence. */
  marginPence: number;
}

export interface HoursComparison {
  stages: StageComparison[];
  total: Omit<StageComparison, 'stage'>;
  hourlyRatePence: number;
}

const pence = (d: Decimal) => d.toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();

/** Quoted and logged hours per stage (in the stages' order), with the margin at the hourly rate. */
export function compareHours(labour: readonly QuotedLabourLine[], logged: readonly LoggedHours[], hourlyRatePence: number): HoursComparison {
  const rows = new Map<string | null, { quoted: Decimal; value: Decimal; logged: Decimal }>();
  const row = (stage: string | null) => {
    let r = rows.get(stage);
    if (!r) rows.set(stage, (r = { quoted: new Decimal(0), value: new Decimal(0), logged: new Decimal(0) }));
    return r;
  };
  for (const l of labour) {
    const r = row(l.stage);
    r.quoted = r.quoted.plus(l.quantity);
    r.value = r.value.plus(new Decimal(l.quantity).times(l.unitPricePence));
  }
  for (const h of logged) row(h.stage).logged = row(h.stage).logged.plus(h.hours);
  const order = (s: string | null) => (s === null ? STAGES.length : (STAGES as readonly string[]).indexOf(s));
  const shown = (quoted: Decimal, value: Decimal, hours: Decimal) => {
    const quotedPence = pence(value);
    const loggedCostPence = pence(hours.times(hourlyRatePence));
    return { quotedHours: quoted.toFixed(2), loggedHours: hours.toFixed(2), differenceHours: hours.minus(quoted).toFixed(2), quotedPence, loggedCostPence, marginPence: quotedPence - loggedCostPence };
  };
  const stages = [...rows].sort(([a], [b]) => order(a) - order(b)).map(([stage, r]) => ({ stage, ...shown(r.quoted, r.value, r.logged) }));
  const sum = (pick: (r: { quoted: Decimal; value: Decimal; logged: Decimal }) => Decimal) => [...rows.values()].reduce((a, r) => a.plus(pick(r)), new Decimal(0));
  const total = shown(sum((r) => r.quoted), sum((r) => r.value), sum((r) => r.logged));
  // The total's margin is the rows' margins added, so the page's column adds up.
  total.marginPence = stages.reduce((a, s) => a + s.marginPence, 0);
  total.quotedPence = stages.reduce((a, s) => a + s.quotedPence, 0);
  total.loggedCostPence = stages.reduce((a, s) => a + s.loggedCostPence, 0);
  return { stages, total, hourlyRatePence };
}

/** A finished commission as the estimate learns from it. */
export interface FinishedCommission {
  commissionId: number;
  /** When it was finished (delivered), ISO; the newest are used. */
  finishedAt: string;
  /** The block kind most of its design's positions use; null without a design. */
  blockKind: string | null;
  /** Quoted and logged hours per stage. */
  stages: Readonly<Record<string, { quotedHours: Decimal.Value; loggedHours: Decimal.Value }>>;
}

export interface LearnedRatio {
  stage: string;
  /** Median of logged / quoted, two decimals. */
  ratio: string;
  /** How many finished commissions it is the median of. */
  commissions: number;
  /** The block kind the commissions were matched on; null when any kind was used. */
  blockKind: string | null;
  /** For the maker: "from 7 finished commissions: logged 1.18× quoted for piecing". */
  basis: string;
}

/** The newest finished commissions a ratio is the median of. */
export const LEARN_FROM_LAST = 10;
/** Fewer finished commissions than this teach nothing yet (a choice: one or two odd jobs should not move a quote). */
export const LEARN_AT_LEAST = 3;

/** The middle value; the mean of the two middle values for an even count. */
export function median(values: readonly Decimal[]): Decimal {
  if (values.length === 0) throw new RangeError('median of nothing');
  const sorted = [...values].sort((a, b) => a.comparedTo(b));
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid]! : sorted[mid - 1]!.plus(sorted[mid]!).dividedBy(2);
}

/**
 * For each stage, the median of logged / quoted hours over the last ten
 * finished commissions that quoted and logged that stage: those of the same
 * block kind when there are at least three, else those of any kind. A stage
 * quoted but with no hours logged is left out (more likely not logged than free).
 */
export function learnedRatios(history: readonly FinishedCommission[], blockKind: string | null, stages: readonly string[]): LearnedRatio[] {
  const newest = [...history].sort((a, b) => b.finishedAt.localeCompare(a.finishedAt));
  const out: LearnedRatio[] = [];
  for (const stage of stages) {
    const usable = newest.filter((c) => {
      const s = c.stages[stage];
      return s !== undefined && new Decimal(s.quotedHours).gt(0) && new Decimal(s.loggedHours).gt(0);
    });
    const sameKind = blockKind === null ? [] : usable.filter((c) => c.blockKind === blockKind);
    const matched = sameKind.length >= LEARN_AT_LEAST ? sameKind : usable;
    const used = matched.slice(0, LEARN_FROM_LAST);
    if (used.length < LEARN_AT_LEAST) continue;
    const ratio = median(used.map((c) => new Decimal(c.stages[stage]!.loggedHours).dividedBy(c.stages[stage]!.quotedHours))).toFixed(2);
    const kind = matched === sameKind && blockKind !== null ? blockKind : null;
    const kindWords = kind === null ? '' : ` of ${(BLOCK_KIND_LABELS[kind as BlockKind] ?? kind).toLowerCase()} blocks`;
    out.push({ stage, ratio, commissions: used.length, blockKind: kind, basis: `from ${plural(used.length, 'finished commission')}${kindWords}: logged ${ratio}\u00d7 quoted for ${stage}` });
  }
  return out;
}

/** A quoted quantity of hours grown (or shrunk) by a learned ratio, to the next quarter hour. */
export function learnedHours(quantity: Decimal.Value, ratio: Decimal.Value): string {
  return quarterHours(new Decimal(quantity).times(ratio));
}

/** The block kind most of a design's positions use (the first such block on a tie); null for no positions. */
export function mainBlockKind(body: DesignBody, derived: Pick<DesignDerivation, 'positions'>): string | null {
  const kindOf = new Map(body.blocks.map((b) => [b.id, b.kind]));
  const counts = new Map<string, number>();
  for (const p of derived.positions) {
    const kind = kindOf.get(p.blockId);
    if (kind) counts.set(kind, (counts.get(kind) ?? 0) + 1);
  }
  let best: string | null = null;
  for (const [kind, n] of counts) if (best === null || n > counts.get(best)!) best = kind;
  return best;
}
