import { buildPlanModel } from './plan-model';
import { betterPlan, runStrategies, searchPlan, type PlanState } from './plan-search';

const state = (minimumDeficit: number, placedArea: number, placedCount: number) =>
  ({ minimumDeficit, placedArea, placedCount }) as PlanState;

describe('plan search', () => {
  it('prefers meeting minimums, then more area, then more pieces', () => {
    expect(betterPlan(state(0, 10, 1), state(1, 99, 9))).toBe(true);
    expect(betterPlan(state(0, 11, 1), state(0, 10, 9))).toBe(true);
    expect(betterPlan(state(0, 10, 2), state(0, 10, 1))).toBe(true);
    expect(betterPlan(state(0, 10, 1), state(0, 10, 1))).toBe(false);
  });

  it('stops trying orders once one places everything', () => {
    const model = buildPlanModel({ panels: [{ garmentId: 'g', panelId: 'p', width: 20, height: 20 }], pieces: [{ id: 'a', width: 5, height: 5, count: 4 }] });
    expect(runStrategies(model)).toHaveLength(1);
  });

  it('tries every order when something is short, and keeps the best', () => {
    const model = buildPlanModel({
      panels: [
        { garmentId: 'g', panelId: 'p', width: 21, height: 13 },
        { garmentId: 'h', panelId: 'q', width: 9, height: 30 },
      ],
      pieces: [
        { id: 'a', width: 6.5, height: 6.5, count: 9 },
        { id: 'b', width: 2.5, height: 20.5, count: 6, grain: 'lengthwise' },
        { id: 'c', width: 3.5, height: 3.5, count: 20 },
      ],
    });
    const all = runStrategies(model);
    expect(all.length).toBeGreaterThan(1);
    const best = searchPlan(model);
    for (const s of all) expect(betterPlan(s, best)).toBe(false);
  });

  it('gives a garment its minimum before filling the others', () => {
    const model = buildPlanModel({
      panels: [
        { garmentId: 'big', panelId: 'p', width: 30, height: 30 },
        { garmentId: 'small', panelId: 'q', width: 7, height: 7 },
      ],
      pieces: [{ id: 'a', width: 6.5, height: 6.5, count: 1 }],
      rules: { garmentMinimums: [{ garmentId: 'small', count: 1 }] },
    });
    const best = searchPlan(model);
    expect(best.minimumDeficit).toBe(0);
    expect(best.binPieces[1]).toBe(1);
  });
});
