import { deriveDesign } from './derive-design';
import { planDesign, type DesignSources } from './plan-design';
import { inch, squaresDesign } from '../testing/design-fixtures';

/** Two shirts: a large back that holds every square, and a small pocket panel that holds one 8 1/2 in square. */
const shirts: DesignSources = {
  garments: [
    { id: 1, description: 'Blue work shirt', colour: 'blue', fibre: 'cotton', construction: 'woven', print: 'non_directional', panels: [{ id: 11, name: 'back', widthMm: inch(30), heightMm: inch(30), grain: 'vertical' }] },
    { id: 2, description: 'Striped school shirt', colour: 'white', fibre: 'cotton', construction: 'woven', print: 'non_directional', panels: [{ id: 21, name: 'front', widthMm: inch(9), heightMm: inch(9), grain: 'vertical' }] },
  ],
  stock: [],
};

describe('every garment in a memory piece gives at least one piece', () => {
  // A 2 x 2 top of 8 in squares: four 8 1/2 in cut squares (8 in + 2 x 1/4 in seam allowance, common practice).
  const body = squaresDesign(8, 2, 2);
  const derived = deriveDesign(body);

  it('asks at least one piece of each garment when the rule is left at 0', () => {
    expect(body.rules.minimumPerGarment).toBe(0);
    const plan = planDesign(body, derived, shirts);
    const given = Object.fromEntries(plan.garments.map((g) => [g.garmentId, g.piecesCut]));
    expect(given[2]).toBeGreaterThanOrEqual(1);
    expect(given[1]! + given[2]!).toBe(4);
    expect(plan.garmentsGivingNone).toEqual([]);
  });

  it('warns, naming the garment, when a garment gives none', () => {
    // The school shirt's 7 in panel cannot hold an 8 1/2 in square.
    const small: DesignSources = { ...shirts, garments: [shirts.garments[0]!, { ...shirts.garments[1]!, panels: [{ id: 21, name: 'front', widthMm: inch(7), heightMm: inch(7), grain: 'vertical' }] }] };
    const plan = planDesign(body, derived, small);
    expect(plan.garmentsGivingNone).toEqual([
      {
        garmentId: 2,
        description: 'Striped school shirt',
        message: 'Striped school shirt gives no piece to this quilt. Give it a block or a group of garments in the table, choose a smaller block so its panels hold a piece, or mark it not used.',
      },
    ]);
  });

  it('asks nothing of a garment the maker marks not used, and does not warn about it', () => {
    const plan = planDesign({ ...body, rules: { minimumPerGarment: 0, unusedGarmentIds: [2] } }, derived, shirts);
    expect(plan.garments.find((g) => g.garmentId === 2)?.piecesCut ?? 0).toBe(0);
    expect(plan.garmentsGivingNone).toEqual([]);
  });
});
