import { buildPlanModel } from './plan-model';
import { extraLength, shortReason, smallestCover } from './shortfall';

describe('shortfall', () => {
  it('gives the smallest cover of n copies: exactly their area, the squarest such grid', () => {
    // derived: area n * w * h is the least any fabric holding them can have.
    expect(smallestCover(2, 3, 6)).toEqual({ w: 6, h: 6 });
    expect(smallestCover(5, 5, 7)).toEqual({ w: 35, h: 5 });
    expect(smallestCover(4, 4, 1)).toEqual({ w: 4, h: 4 });
    const c = smallestCover(3, 2, 12);
    expect(c.w * c.h).toBe(12 * 6);
    // derived: 3 columns x 4 rows of 3 x 2 make 9 x 8, the squarest exact grid.
    expect(c).toEqual({ w: 9, h: 8 });
  });

  it('finds the length of fabric that holds pieces at a fixed width', () => {
    // common practice (yardage worked example): 40 squares of 6 1/2 in from 42 in
    // usable width: 6 per strip, 7 strips, 45 1/2 in.
    const model = buildPlanModel({
      panels: [],
      studioFabrics: [{ fabricId: 'w', width: 42, length: 10 }],
      pieces: [{ id: 'sq', width: 6.5, height: 6.5, count: 40, source: { kind: 'studio-fabric', fabricId: 'w' } }],
    });
    expect(extraLength(model, model.bins[0], [{ type: 0, count: 40 }])).toBe(45500);
  });

  it('tells no room, rules and size apart', () => {
    const model = buildPlanModel({
      panels: [
        { garmentId: 'g', panelId: 'p', width: 10, height: 20, directional: true },
      ],
      pieces: [
        { id: 'fits', width: 5, height: 5, count: 1 },
        { id: 'turn', width: 20, height: 10, count: 1 },
        { id: 'huge', width: 30, height: 30, count: 1 },
        { id: 'elsewhere', width: 1, height: 1, count: 1, source: { kind: 'garment', garmentId: 'missing' } },
      ],
    });
    expect(shortReason(model, 0).reason).toBe('not-enough-area');
    expect(shortReason(model, 1).reason).toBe('rule-not-met');
    expect(shortReason(model, 2).reason).toBe('no-panel-large-enough');
    expect(shortReason(model, 3)).toEqual({ reason: 'rule-not-met', detail: 'no panels are listed for garment "missing"' });
  });
});
