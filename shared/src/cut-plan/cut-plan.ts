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
import { searchPlan } from './plan-search';
import type { CutPlan, CutPlanInput } from './cut-plan-types';

export type * from './cut-plan-types';

/**
 * Plans every piece into the garment panels and studio fabrics with
 * guillotine cuts. Deterministic: the same input always gives the same plan.
 * Throws CutPlanInputError for input it cannot work with (bad sizes,
 * duplicate ids, unknown kept features).
 */
export function planCuts(input: CutPlanInput): CutPlan {
  const model = buildPlanModel(input);
  const best = searchPlan(model);
  return reportPlan(model, best);
}
