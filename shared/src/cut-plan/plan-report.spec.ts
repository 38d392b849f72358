import { buildPlanModel } from './plan-model';
import { reportPlan } from './plan-report';
import { searchPlan } from './plan-search';

describe('plan report', () => {
  it('numbers copies per piece and hands merged pieces out in input order', () => {
    const model = buildPlanModel({
      panels: [{ garmentId: 'g', panelId: 'p', width: 13, height: 6.5 }],
      pieces: [
        { id: 'first', width: 6.5, height: 6.5, count: 1 },
        { id: 'second', width: 6.5, height: 6.5, count: 2 },
      ],
    });
    const plan = reportPlan(model, searchPlan(model));
    expect(plan.placements.map((p) => `${p.pieceId} #${p.copy}`)).toEqual(['first #1', 'second #1']);
    expect(plan.shortfall.pieces).toEqual([expect.objectContaining({ pieceId: 'second', count: 1 })]);
  });

  it('works out yield per panel, per garment and in total', () => {
    const model = buildPlanModel({
      panels: [
        { garmentId: 'g', panelId: 'p', width: 10, height: 10 },
        { garmentId: 'g', panelId: 'q', width: 10, height: 10 },
      ],
      pieces: [{ id: 'a', width: 5, height: 5, count: 5 }],
    });
    const plan = reportPlan(model, searchPlan(model));
    // derived: 5 x 25 = 125 of 200 square units; one panel full (100%), the other 25%.
    expect(plan.panels.map((p) => p.yield)).toEqual([1, 0.25]);
    expect(plan.garments[0]).toMatchObject({ area: 200, areaUsed: 125, yield: 0.625, piecesCut: 5 });
    expect(plan.totals).toMatchObject({ piecesRequested: 5, piecesPlaced: 5, piecesShort: 0, garmentYield: 0.625, yield: 0.625 });
  });

  it('reports unlimited fabric by the length used', () => {
    const model = buildPlanModel({
      panels: [],
      studioFabrics: [{ fabricId: 'binding', width: 42, length: 'unlimited' }],
      pieces: [{ id: 'strip', width: 42, height: 2.5, count: 8, source: { kind: 'studio-fabric', fabricId: 'binding' } }],
    });
    const plan = reportPlan(model, searchPlan(model));
    // common practice (binding worked example): 8 strips of 2 1/2 in = 20 in of fabric.
    expect(plan.studioFabrics[0]).toMatchObject({ lengthUsed: 20, piecesCut: 8, lengthAvailable: 'unlimited' });
    expect(plan.panels[0]).toMatchObject({ height: 20, yield: 1 });
  });
});
