import { allowedTurns, buildPlanModel, orientationsIn } from './plan-model';
import { CutPlanInputError } from './cut-plan-input-error';

describe('plan model', () => {
  it('allows turning only where neither print nor grain forbids it', () => {
    const free = { rotate: true, lengthwise: false };
    const grain = { rotate: true, lengthwise: true };
    expect(allowedTurns(free, { grain: 'along-height', directional: false })).toEqual({ unturned: true, turned: true });
    expect(allowedTurns(free, { grain: 'along-height', directional: true })).toEqual({ unturned: true, turned: false });
    expect(allowedTurns(grain, { grain: 'along-height', directional: false })).toEqual({ unturned: true, turned: false });
    expect(allowedTurns(grain, { grain: 'along-width', directional: false })).toEqual({ unturned: false, turned: true });
    expect(allowedTurns(grain, { grain: 'along-width', directional: true })).toEqual({ unturned: false, turned: false });
    expect(allowedTurns(grain, { grain: 'unknown', directional: false })).toEqual({ unturned: false, turned: false });
    expect(allowedTurns({ rotate: false, lengthwise: false }, { grain: 'along-height', directional: false })).toEqual({ unturned: true, turned: false });
  });

  it('works in thousandths, pieces up and panels down, and merges interchangeable pieces', () => {
    const model = buildPlanModel({
      panels: [{ garmentId: 'g', panelId: 'p', width: 200 / 25.4, height: 10 }],
      pieces: [
        { id: 'a', width: 6.5, height: 6.5, count: 3 },
        { id: 'b', width: 6.5, height: 6.5, count: 2 },
        { id: 'c', width: 6.5, height: 6.5, count: 1, grain: 'lengthwise' },
      ],
    });
    expect(model.bins[0]).toMatchObject({ w: 7874, h: 10000 });
    expect(model.types).toHaveLength(2);
    expect(model.types[0]).toMatchObject({ w: 6500, h: 6500, count: 5, members: [{ piece: 0, count: 3 }, { piece: 1, count: 2 }] });
  });

  it('lists a square once, and a rectangle both ways where turning is allowed', () => {
    const model = buildPlanModel({ panels: [{ garmentId: 'g', panelId: 'p', width: 20, height: 20 }], pieces: [] });
    expect(orientationsIn({ w: 5, h: 5, rotate: true, lengthwise: false }, model.bins[0])).toHaveLength(1);
    expect(orientationsIn({ w: 5, h: 7, rotate: true, lengthwise: false }, model.bins[0]).map((o) => o.rotated)).toEqual([false, true]);
  });

  it('rejects sizes that are not positive numbers, and duplicate ids', () => {
    expect(() =>
      buildPlanModel({ panels: [{ garmentId: 'g', panelId: 'p', width: Number.NaN, height: 1 }], pieces: [{ id: 'x', width: 1, height: 1, count: -1 }] }),
    ).toThrow(CutPlanInputError);
    expect(() => buildPlanModel({ panels: [], studioFabrics: [{ fabricId: 'f', width: 42, length: 0 }], pieces: [] })).toThrow(/length/);
  });
});
