// The cut planner: which piece comes from which garment panel or studio
// fabric, where it lies, and the straight edge-to-edge cuts that free it.
//
// Every length in the input and output is a plain number in ONE unit chosen
// by the caller (the app passes inches: 6.5, or metric-derived values such as
// 7.874...). Internally the planner works in whole thousandths of that unit,
// rounding piece sizes up and panel sizes down (see scaled-units.ts), so a
// plan never leaves a piece short of fabric. The result is plain JSON.
//
// Coordinates: x runs to the right along a panel's width, y downwards along
// its height, from the panel's top-left corner.

export { CutPlanInputError } from './cut-plan-input-error';
import { buildPlanModel } from './plan-model';
import { reportPlan } from './plan-report';
import { improvePlan } from './plan-improve';
import { searchPlan } from './plan-search';
import type { CutPlan, CutPlanInput } from './cut-plan-types';

export type * from './cut-plan-types';

export interface PlanCutsOptions {
  /**
   * Time the improvement search may spend, in milliseconds (0: the fast
   * construction only). It is spent as a count of search nodes at a fixed
   * rate (NODES_PER_MS), never read from a clock, so the same input and
   * budget give the same plan on any machine; on a slow machine the search
   * takes longer than the budget, on a fast one less.
   */
  budgetMs?: number;
}

/** The design page's budget: it plans as the maker types. */
export const INTERACTIVE_BUDGET_MS = 150;
/** Printing and saving may wait this long for a better plan. */
export const THOROUGH_BUDGET_MS = 2000;
/** Search nodes per millisecond of budget, set so the search stays within its budget on a 2-core development machine. */
export const NODES_PER_MS = 200;

/**
 * Plans every piece into the garment panels and studio fabrics with
 * guillotine cuts. Deterministic: the same input always gives the same plan.
 * Throws CutPlanInputError for input it cannot work with (bad sizes,
 * duplicate ids, unknown kept features).
 */
export function planCuts(input: CutPlanInput, options: PlanCutsOptions = {}): CutPlan {
  const model = buildPlanModel(input);
  const built = searchPlan(model);
  const budget = options.budgetMs ?? INTERACTIVE_BUDGET_MS;
  const best = improvePlan(model, built, Math.max(0, Math.floor(budget * NODES_PER_MS)));
  return reportPlan(model, best);
}
