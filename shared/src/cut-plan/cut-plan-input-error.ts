// The one error the cut planner throws: input it cannot work with.

/** Input the planner cannot work with; `problems` lists every fault found, for the maker. */
export class CutPlanInputError extends Error {
  override readonly name = 'CutPlanInputError';
  /** Stable for programs (the server answers 400 with it). */
  readonly code = 'invalid-cut-plan-input';

  constructor(readonly problems: string[]) {
    super(`Cannot plan the cuts: ${problems.join('; ')}`);
  }
}
