import { DesignBody, DesignPlanSummary, deriveDesign, fabricKey } from '@keepstitch/shared';

import { DesignScreen, DesignVersion, GarmentSource } from '../app/designs/design';

const inch = (n: number) => String((n * 254) / 10);

/** A 2 x 2 design of 12 in blocks: plain squares and a 20-blade plate (A B / B A). */
export function plateDesign(over: Partial<DesignBody> = {}): DesignBody {
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(24), lengthMm: inch(24) },
    layout: { setting: 'straight', rows: 2, columns: 2, blockMm: inch(12), sashing: null, borders: [] },
    blocks: [
      { id: 'A', name: 'Plain square', kind: 'square' },
      { id: 'B', name: 'Dresden plate', kind: 'plate', blades: 20, outerRadiusMm: inch(4.5), innerRadiusMm: inch(2) },
    ],
    pattern: ['A', 'B', 'B', 'A'],
    assignments: [],
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
    rules: { minimumPerGarment: 0 },
    ...over,
  };
}

/** A plan summary with only what the screens read; the cut plan itself is empty. */
export function emptyPlan(placed = 0, requested = 0): DesignPlanSummary {
  return {
    plan: { placements: [], panels: [], garments: [], studioFabrics: [], shortfall: { pieces: [], garmentMinimums: [] } },
    garments: [],
    shortfall: [],
    minimumsShort: [],
    shopping: [],
    binding: { stockId: null, strips: 2, stripWidthMm: '63.5', lengthMm: '2700', fabricLengthMm: '127' },
    backing: { stockId: null, widthMm: '710', lengthMm: '710', panels: 1, fabricLengthMm: '710', method: 'one panel' },
    wadding: { stockId: null, widthMm: '710', lengthMm: '710', fromRollMm: null, pieces: null },
    totals: { piecesRequested: requested, piecesPlaced: placed, piecesShort: requested - placed, garmentYield: 0.5 },
  } as unknown as DesignPlanSummary;
}

export function version(n: number, body: DesignBody = plateDesign(), over: Partial<DesignVersion> = {}): DesignVersion {
  return {
    id: 100 + n,
    version: n,
    body,
    derived: deriveDesign(body),
    plan: emptyPlan(10, 12),
    note: null,
    createdAt: `2026-11-0${n}T10:00:00.000Z`,
    sharedAt: null,
    clientResponse: null,
    clientNote: null,
    respondedAt: null,
    ...over,
  };
}

/** The design screen of commission 5, "Work-shirt memory quilt", with the given current version. */
export function designScreen(current: DesignVersion | null = version(1), earlier: DesignVersion[] = [], over: Partial<DesignScreen> = {}): DesignScreen {
  const all = current ? [current, ...earlier] : earlier;
  return {
    commission: { id: 5, title: 'Work-shirt memory quilt', kind: 'memory_quilt', ageGroup: 'adult', sizePreset: null, widthMm: null, lengthMm: null, stage: 'design' },
    current,
    versions: all.map(({ id, version: v, note, createdAt, sharedAt, clientResponse, clientNote, respondedAt }) => ({ id, version: v, note, createdAt, sharedAt, clientResponse, clientNote, respondedAt })),
    fabrics: [{ key: 'garment:8', kind: 'garment', id: 8, name: 'Blue oxford work shirt', colour: 'blue', hex: '#3b5b92' }],
    garments: [],
    stock: [],
    ...over,
  };
}

const panel = (id: number, name: string, w: number, h: number) => ({ id, name, widthMm: inch(w), heightMm: inch(h), grain: 'vertical' });

/** Three shirts of commission 5 with their measured panels: 8 blue, 9 navy, 10 green. */
export function threeShirts(): { garments: GarmentSource[]; fabrics: DesignScreen['fabrics'] } {
  const garments: GarmentSource[] = [
    { id: 8, description: 'Blue oxford work shirt', colour: 'Pale blue', fibre: 'cotton', print: 'plain', construction: 'woven', panels: [panel(81, 'back', 22, 27)] },
    { id: 9, description: 'Navy knit polo', colour: 'Navy', fibre: 'knit_jersey', print: 'plain', construction: 'knit', panels: [panel(91, 'back', 19.5, 25)] },
    { id: 10, description: 'Green checked flannel shirt', colour: 'Green and cream check', fibre: 'flannel', print: 'non_directional', construction: 'woven', panels: [panel(101, 'back', 21, 26.5)] },
  ];
  const hex: Record<number, string> = { 8: '#9db7d5', 9: '#26355d', 10: '#4f7a52' };
  const fabrics = garments.map((g) => ({ key: fabricKey({ kind: 'garment', garmentId: g.id }), kind: 'garment' as const, id: g.id, name: g.description, colour: g.colour, hex: hex[g.id]!, detail: '1 panel' }));
  return { garments, fabrics };
}
