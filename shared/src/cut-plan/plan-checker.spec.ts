import Decimal from 'decimal.js';
import { planCuts, type CutPlan, type CutPlanInput } from './cut-plan';
import { checkPlan, guillotineSeparable } from './plan-checker';

const box = (x: number, y: number, w: number, h: number) => ({ x: new Decimal(x), y: new Decimal(y), w: new Decimal(w), h: new Decimal(h) });

const input: CutPlanInput = {
  panels: [
    { garmentId: 'g', panelId: 'p', width: 13, height: 13, features: [{ id: 'f', x: 1, y: 1, width: 2, height: 2 }] },
    { garmentId: 'g', panelId: 'd', width: 10, height: 20, directional: true },
  ],
  pieces: [
    { id: 'kept', width: 4, height: 4, count: 1, keptFeature: { featureId: 'f', placement: { x: 1, y: 1 } } },
    { id: 'sq', width: 6.5, height: 6.5, count: 3 },
    { id: 'long', width: 4, height: 9, count: 2 },
  ],
};

function fresh(): CutPlan {
  return structuredClone(planCuts(input));
}

describe('the independent plan checker', () => {
  it('finds nothing wrong with a sound plan', () => {
    expect(checkPlan(input, fresh())).toEqual([]);
  });

  it('knows a pinwheel cannot be cut apart edge to edge, and a grid can', () => {
    // derived: the five-piece pinwheel is the smallest layout with no full cut
    // (every straight line through the square crosses a piece).
    const pinwheel = [box(0, 0, 2, 1), box(2, 0, 1, 2), box(1, 2, 2, 1), box(0, 1, 1, 2), box(1, 1, 1, 1)];
    expect(guillotineSeparable(pinwheel)).toBe(false);
    expect(guillotineSeparable([box(0, 0, 1, 1), box(1, 0, 1, 1), box(0, 1, 2, 1)])).toBe(true);
  });

  it('reports a pinwheel plan, whatever its cut list says', () => {
    const plan = fresh();
    const pin: CutPlanInput = {
      panels: [{ garmentId: 'g', panelId: 'w', width: 3, height: 3 }],
      pieces: [
        { id: 'a', width: 2, height: 1, count: 2 },
        { id: 'b', width: 1, height: 2, count: 2 },
        { id: 'c', width: 1, height: 1, count: 1 },
      ],
    };
    plan.placements = [
      { pieceId: 'a', copy: 1, panelId: 'w', garmentId: 'g', x: 0, y: 0, width: 2, height: 1, rotated: false },
      { pieceId: 'b', copy: 1, panelId: 'w', garmentId: 'g', x: 2, y: 0, width: 1, height: 2, rotated: false },
      { pieceId: 'a', copy: 2, panelId: 'w', garmentId: 'g', x: 1, y: 2, width: 2, height: 1, rotated: false },
      { pieceId: 'b', copy: 2, panelId: 'w', garmentId: 'g', x: 0, y: 1, width: 1, height: 2, rotated: false },
      { pieceId: 'c', copy: 1, panelId: 'w', garmentId: 'g', x: 1, y: 1, width: 1, height: 1, rotated: false },
    ];
    plan.panels = [{ ...plan.panels[0], panelId: 'w', width: 3, height: 3, usableWidth: 3, usableHeight: 3, piecesCut: 5, areaUsed: 9, cuts: [] }];
    plan.shortfall.pieces = [];
    const faults = checkPlan(pin, plan);
    expect(faults).toContainEqual(expect.stringContaining('cannot be cut apart edge to edge'));
  });

  it('reports overlapping pieces', () => {
    const plan = fresh();
    const [a, b] = plan.placements.filter((p) => p.pieceId === 'sq');
    b.x = a.x + 1;
    b.y = a.y;
    b.panelId = a.panelId;
    expect(checkPlan(input, plan).join('\n')).toMatch(/overlaps/);
  });

  it('reports a piece turned on a directional print, or running off its panel', () => {
    const plan = fresh();
    const long = plan.placements.find((p) => p.panelId === 'd');
    expect(long).toBeDefined();
    if (!long) return;
    long.rotated = true;
    [long.width, long.height] = [long.height, long.width];
    expect(checkPlan(input, plan).join('\n')).toMatch(/turned breaks the turning or grain rules/);
    const other = fresh();
    const moved = other.placements.find((p) => p.pieceId === 'long') as CutPlan['placements'][number];
    moved.x = 8;
    expect(checkPlan(input, other).join('\n')).toMatch(/runs off the panel/);
  });

  it('reports a kept feature left outside its piece', () => {
    const plan = fresh();
    const kept = plan.placements.find((p) => p.pieceId === 'kept') as CutPlan['placements'][number];
    kept.x += 2;
    expect(checkPlan(input, plan).join('\n')).toMatch(/kept feature .* is not whole inside|offset/);
  });

  it('reports a copy neither placed nor reported short', () => {
    const plan = fresh();
    plan.placements = plan.placements.filter((p) => !(p.pieceId === 'sq' && p.copy === 1));
    expect(checkPlan(input, plan).join('\n')).toMatch(/piece sq: 2 placed \+ 0 short != 3/);
  });

  it('reports a cut list that does not free the pieces where they are placed', () => {
    const plan = fresh();
    const panel = plan.panels.find((p) => p.cuts.length > 0) as CutPlan['panels'][number];
    panel.cuts[0].at += 0.5;
    expect(checkPlan(input, plan).length).toBeGreaterThan(0);
  });

  it('reports a shortfall reason that is not true', () => {
    const plan = planCuts({ panels: [{ garmentId: 'g', panelId: 'p', width: 5, height: 5 }], pieces: [{ id: 'big', width: 6, height: 6, count: 1 }] });
    expect(checkPlan({ panels: [{ garmentId: 'g', panelId: 'p', width: 5, height: 5 }], pieces: [{ id: 'big', width: 6, height: 6, count: 1 }] }, plan)).toEqual([]);
    plan.shortfall.pieces[0].reason = 'not-enough-area';
    expect(
      checkPlan({ panels: [{ garmentId: 'g', panelId: 'p', width: 5, height: 5 }], pieces: [{ id: 'big', width: 6, height: 6, count: 1 }] }, plan),
    ).toEqual([expect.stringContaining('the reason is no-panel-large-enough')]);
  });

  it('reports a garment minimum neither met nor reported', () => {
    const withMinimum: CutPlanInput = { ...input, rules: { garmentMinimums: [{ garmentId: 'g', count: 50 }] } };
    const plan = structuredClone(planCuts(withMinimum));
    expect(checkPlan(withMinimum, plan)).toEqual([]);
    plan.shortfall.garmentMinimums = [];
    expect(checkPlan(withMinimum, plan).join('\n')).toMatch(/garment g: \d+ of 50 pieces and not reported/);
  });
});
