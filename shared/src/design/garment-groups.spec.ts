import { deriveDesign } from './derive-design';
import type { DesignBody } from './design-body';
import { garmentGroupProblems, groupLegendEntry, nextGroupId, upgradeStoredDesign, type StoredDesignBody } from './garment-groups';
import { planDesign, cutPlanInput, type DesignSources } from './plan-design';
import { DomainError } from '../errors';
import { inch, squaresDesign } from '../testing/design-fixtures';

/** Two rows of two 8 in plain squares, nothing given to anything. */
const squares = (over: Partial<DesignBody> = {}) => squaresDesign(8, 2, 2, over);

const blues = { id: 'g1', name: 'The blues', garmentIds: [8, 9] };

describe('garmentGroupProblems', () => {
  it('finds nothing wrong with distinct groups, one of them given to nothing', () => {
    const body = squares({ groups: [blues, { id: 'g2', name: 'Checks', garmentIds: [10] }], assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'group', groupId: 'g1' } }] });
    expect(garmentGroupProblems(body)).toEqual({});
  });

  it('refuses a second group with the same id, or the same name (trimmed, any case), a garment listed twice, and an assignment naming no group', () => {
    const body = squares({
      groups: [blues, { id: 'g1', name: 'Warm', garmentIds: [10] }, { id: 'g3', name: '  the BLUES ', garmentIds: [11, 11] }],
      assignments: [
        { target: { kind: 'position', index: 0 }, fabric: { kind: 'group', groupId: 'g1' } },
        { target: { kind: 'piece', key: 'block:B:square' }, fabric: { kind: 'group', groupId: 'g7' } },
      ],
    });
    expect(garmentGroupProblems(body)).toEqual({
      'groups.1.id': 'Another group has this id.',
      'groups.2.name': 'Another group has this name.',
      'groups.2.garmentIds': 'A garment is in this group twice.',
      'assignments.1.fabric.groupId': 'The design has no group with this id.',
    });
  });

  it('is the rule the derivation keeps: a design naming a group it does not list cannot be worked out', () => {
    const body = squares({ assignments: [{ target: { kind: 'position', index: 2 }, fabric: { kind: 'group', groupId: 'g1' } }] });
    expect(() => deriveDesign(body)).toThrow(DomainError);
    expect(() => deriveDesign(body)).toThrow('The design has no group with this id.');
    expect(() => deriveDesign({ ...body, groups: [blues] })).not.toThrow();
  });
});

describe('groupLegendEntry', () => {
  it('keys a group by its id and draws it in stripes of its garments, with their mean and a count', () => {
    const colours: Record<number, string> = { 8: '#9db7d5', 9: '#26355d' };
    // Derived: the mean of #9db7d5 and #26355d is #627699 (fabric-colour.spec.ts).
    expect(groupLegendEntry(blues, (id) => colours[id])).toEqual({ key: 'group:g1', name: 'The blues', hex: '#627699', stripes: ['#9db7d5', '#26355d'], detail: 'any of 2 garments' });
    expect(groupLegendEntry({ id: 'g2', name: 'One', garmentIds: [8] }, (id) => colours[id]).detail).toBe('any of 1 garment');
  });
});

describe('nextGroupId', () => {
  it('takes the first of g1, g2... not in use', () => {
    expect(nextGroupId([])).toBe('g1');
    expect(nextGroupId([{ id: 'g1' }, { id: 'g3' }])).toBe('g2');
  });
});

describe('upgradeStoredDesign: designs saved before the groups were listed', () => {
  const oldBlues = { kind: 'group' as const, name: 'The blues', garmentIds: [9, 8] };
  const oldWarm = { kind: 'group' as const, name: 'Warm', garmentIds: [10, 11] };
  /** As an older version stored it: no list, each group written out in the assignments (twice for the blues, in another order). */
  function stored(): StoredDesignBody {
    const { groups: _, ...rest } = squares();
    return {
      ...rest,
      assignments: [
        { target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: 8 } },
        { target: { kind: 'position', index: 1 }, fabric: oldBlues },
        { target: { kind: 'position', index: 2 }, fabric: oldWarm },
        { target: { kind: 'position', index: 3 }, fabric: { ...oldBlues, garmentIds: [8, 9] } },
      ],
    };
  }

  it('lists the groups once each by their garments, in the order first given, and the assignments name them by id', () => {
    const { body } = upgradeStoredDesign(stored(), undefined);
    expect(body.groups).toEqual([
      { id: 'g1', name: 'The blues', garmentIds: [9, 8] },
      { id: 'g2', name: 'Warm', garmentIds: [10, 11] },
    ]);
    expect(body.assignments.map((a) => a.fabric)).toEqual([
      { kind: 'garment', garmentId: 8 },
      { kind: 'group', groupId: 'g1' },
      { kind: 'group', groupId: 'g2' },
      { kind: 'group', groupId: 'g1' },
    ]);
    expect(garmentGroupProblems(body)).toEqual({});
  });

  it('renames the groups in the stored derivation too, so it matches a derivation made afresh', () => {
    // The derivation as the older version stored it: worked out with the groups written out in full.
    const old = stored();
    const oldDerived = deriveDesign({ ...old, groups: [{ id: 'x', name: '-', garmentIds: [] }], assignments: [] });
    const byPosition = new Map(old.assignments.map((a) => [(a.target as { index: number }).index, a.fabric]));
    const asStored = {
      ...oldDerived,
      positions: oldDerived.positions.map((p) => ({ ...p, fabrics: { square: byPosition.get(p.index) ?? null } })),
      pieces: oldDerived.pieces.map((p) => ({ ...p, fabric: oldBlues })),
    } as unknown as ReturnType<typeof deriveDesign>;
    const { body, derived } = upgradeStoredDesign(old, asStored);
    expect(derived.positions.map((p) => p.fabrics['square'])).toEqual(deriveDesign(body).positions.map((p) => p.fabrics['square']));
    expect(derived.pieces.every((p) => JSON.stringify(p.fabric) === JSON.stringify({ kind: 'group', groupId: 'g1' }))).toBe(true);
  });

  it('gives a design with no groups at all an empty list, and leaves a listed design as it is', () => {
    const { groups: _, ...none } = squares();
    expect(upgradeStoredDesign(none, undefined).body.groups).toEqual([]);
    const listed = squares({ groups: [blues], assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'group', groupId: 'g1' } }] });
    expect(upgradeStoredDesign(listed, undefined).body).toEqual(listed);
  });
});

describe('planning a group from the list', () => {
  const panel = (id: number, w: number, h: number) => ({ id, name: 'back', widthMm: inch(w), heightMm: inch(h), grain: 'vertical' as const, features: [] });
  const sources: DesignSources = {
    garments: [8, 9, 10].map((id) => ({ id, description: `Shirt ${id}`, colour: null, fibre: 'cotton', construction: 'woven', print: 'plain', panels: [panel(id * 10, 17, 9)] })),
    stock: [],
  };

  it('lets the planner pick among the listed garments of the group a piece is given, and no others', () => {
    // Each back (17 x 9 in) holds two 8 1/2 in squares, so the four squares need both garments of the group.
    const body = squares({ groups: [blues], assignments: [{ target: { kind: 'piece', key: 'block:B:square' }, fabric: { kind: 'group', groupId: 'g1' } }] });
    const input = cutPlanInput(body, deriveDesign(body), sources);
    expect(input.pieces.map((p) => p.source)).toEqual([{ kind: 'garment-group', name: 'The blues', garmentIds: ['8', '9'] }]);
    const summary = planDesign(body, deriveDesign(body), sources);
    expect(new Set(summary.plan.placements.map((pl) => pl.garmentId))).toEqual(new Set(['8', '9']));
  });
});
