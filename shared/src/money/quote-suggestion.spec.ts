import Decimal from 'decimal.js';
import { deriveDesign } from '../design/derive-design';
import { planDesign, type DesignPlanSummary } from '../design/plan-design';
import type { DesignBody } from '../design/design-body';
import { DEFAULT_BLOCK_MINUTES, quarterHours, suggestQuote } from './quote-suggestion';

const inch = (n: number) => new Decimal(n).times('25.4').toString();

/** 4 x 5 blocks of 12 in, alternating plates and plain squares, no sashing or borders: 48 x 60 in. */
const body: DesignBody = {
  units: 'imperial',
  target: { preset: null, dropMm: null, widthMm: inch(48), lengthMm: inch(60) },
  layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(12), sashing: null, borders: [] },
  blocks: [
    { id: 'A', name: 'Plate', kind: 'plate', blades: 20, outerRadiusMm: inch(5), innerRadiusMm: inch(1.5) },
    { id: 'B', name: 'Square', kind: 'square' },
  ],
  pattern: ['A', 'B'],
  assignments: [],
  finishing: { bindingStockId: 2, bindingStripMm: inch(2.5), backingStockId: 1, waddingStockId: null, prewash: false, shrinkPercent: '0' },
  rules: { minimumPerGarment: 0 },
};

describe('quote lines suggested from a design', () => {
  const derived = deriveDesign(body);
  const stock = [
    { id: 1, name: 'Wide backing', colour: null, fibre: 'cotton' as const, widthMm: inch(108), lengthMm: '0', costUnit: 'metre' as const },
    { id: 2, name: 'Navy cotton', colour: 'navy', fibre: 'cotton' as const, widthMm: inch(44), lengthMm: '0', costUnit: 'yard' as const },
  ];
  const plan: DesignPlanSummary = planDesign(body, derived, { garments: [], stock });
  const priced = [
    { id: 1, name: 'Wide backing', costPence: 1450, costUnit: 'metre' as const },
    { id: 2, name: 'Navy cotton', costPence: 1100, costUnit: 'yard' as const },
  ];
  const input = { body, derived, plan, stock: priced, hourlyRatePence: 3000, blockMinutes: { plate: 90, square: 6 }, knitGarments: 1, garments: 4 };
  const { lines, notes } = suggestQuote(input);
  const labour = Object.fromEntries(lines.filter((l) => l.kind === 'labour').map((l) => [l.stage, l.quantity]));

  it('estimates piecing from the minutes per block kind (hand-worked)', () => {
    // Hand-worked: 10 plates x 90 min + 10 squares x 6 min = 960 min = 16 h.
    expect(labour['piecing']).toBe('16.00');
  });

  it('estimates quilting and binding from the size (common practice rates, rough)', () => {
    // Hand-worked: 48 x 60 in = 1.2192 m x 1.524 m = 1.858 m^2 x 1.5 h = 2.787 h -> 3.00 h (up to the quarter).
    expect(labour['quilting']).toBe('3.00');
    // Perimeter 2 x (48 + 60) in = 216 in = 5.4864 m x 0.2 h = 1.097 h -> 1.25 h.
    expect(labour['binding']).toBe('1.25');
    // 4 garments x 0.75 h = 3 h.
    expect(labour['preparation']).toBe('3.00');
  });

  it('prices every studio fabric the plan uses by its own unit, at its own cost, in shop steps', () => {
    const backing = lines.find((l) => l.description.startsWith('Wide backing'))!;
    const shop = plan.shopping.find((s) => s.stockId === 1)!;
    expect(backing).toMatchObject({ kind: 'material', unit: 'm', unitPricePence: 1450 });
    expect(backing.description).toContain('backing: 1 panel');
    expect(backing.description).toContain('cut in 10 cm steps');
    // Derived: the length used, up to whole 10 cm steps, in metres.
    expect(backing.quantity).toBe(new Decimal(shop.needMm).dividedBy(100).ceil().dividedBy(10).toString());
    const navy = lines.find((l) => l.description.startsWith('Navy cotton'))!;
    const navyShop = plan.shopping.find((s) => s.stockId === 2)!;
    // 1 yd = 914.4 mm exactly (NIST SP 811 appendix B); a quarter yard is 228.6 mm.
    expect(navy).toMatchObject({ unit: 'yd', unitPricePence: 1100 });
    expect(navy.quantity).toBe(new Decimal(navyShop.needMm).dividedBy('228.6').ceil().dividedBy(4).toString());
  });

  it('prices fabric already on hand too: the client pays for what the piece uses, not only for what is bought', () => {
    const stocked = [
      { id: 1, name: 'Wide backing', colour: null, fibre: 'cotton' as const, widthMm: inch(108), lengthMm: '50000', costUnit: 'metre' as const },
      { id: 2, name: 'Navy cotton', colour: 'navy', fibre: 'cotton' as const, widthMm: inch(44), lengthMm: '50000', costUnit: 'yard' as const },
    ];
    const onHand = planDesign(body, derived, { garments: [], stock: stocked });
    expect(onHand.shopping.every((s) => s.buyMm === '0')).toBe(true);
    const fabric = suggestQuote({ ...input, plan: onHand }).lines.filter((l) => l.kind === 'material');
    expect(fabric.map((l) => l.description.split(' (')[0])).toEqual(['Navy cotton', 'Wide backing']);
    expect(fabric.every((l) => l.unitPricePence > 0 && Number(l.quantity) > 0)).toBe(true);
  });

  it('leaves out, with a note, what has no cost kept anywhere rather than pricing it at zero', () => {
    expect(lines.filter((l) => l.unitPricePence === 0)).toEqual([]);
    expect(lines.some((l) => l.kind !== 'labour' && /thread|label|stabiliser|wadding/i.test(l.description))).toBe(false);
    // Wadding 4 in larger than the 48 x 60 in top on every side (common practice): 56 x 68 in = 142.24 x 172.72 cm, up to whole cm.
    expect(notes).toContain("The wadding (143 x 173 cm) is not from Studio fabric: choose it in the design's finishing to price it, or add a line.");
    expect(notes).toContain('Not priced: thread, a sewn-in label, fusible stabiliser for 1 knit garment. The studio keeps no cost for them; add a line if you charge for them.');
    const noCost = suggestQuote({ ...input, stock: [priced[0]!, { ...priced[1]!, costPence: null }] });
    expect(noCost.lines.some((l) => l.description.startsWith('Navy cotton'))).toBe(false);
    expect(noCost.notes.some((n) => n.startsWith('Navy cotton is not priced: Studio fabric holds no cost for it.'))).toBe(true);
  });

  it('says one garment, one piece, one block in the singular', () => {
    const one: DesignBody = { ...body, layout: { ...body.layout, rows: 1, columns: 1 }, blocks: [{ id: 'B', name: 'Square', kind: 'square' }], pattern: ['B'] };
    const d = deriveDesign(one);
    const words = suggestQuote({ ...input, body: one, derived: d, plan: planDesign(one, d, { garments: [], stock: [] }), garments: 1, knitGarments: 0 }).lines.map((l) => l.description);
    expect(words).toEqual(expect.arrayContaining([expect.stringMatching(/^Preparing 1 garment:/), 'Cutting 1 piece', 'Piecing 1 block and the top']));
  });

  it('rounds hours up to the quarter, never below a quarter', () => {
    expect([0.01, 0.25, 0.26, 2.787, 0].map(quarterHours)).toEqual(['0.25', '0.25', '0.50', '3.00', '0.25']);
  });

  it("reads the studio's minutes under each block kind's own key, and each kind's default when the studio has none", () => {
    const rails: DesignBody = { ...body, blocks: [{ id: 'A', name: 'Rails', kind: 'rectangles', units: 3 }, { id: 'B', name: 'Geese', kind: 'flying-geese', units: 2 }] };
    const derivedRails = deriveDesign(rails);
    const piecing = (blockMinutes: Record<string, number>) =>
      suggestQuote({ body: rails, derived: derivedRails, plan: planDesign(rails, derivedRails, { garments: [], stock: [] }), stock: [], hourlyRatePence: 3000, blockMinutes, knitGarments: 0, garments: 0 }).lines.find((l) => l.stage === 'piecing')!.quantity;
    // Hand-worked: 10 rail blocks x 12 min + 10 geese blocks x 30 min = 420 min = 7 h.
    expect(piecing({ rectangles: 12, 'flying-geese': 30 })).toBe('7.00');
    // Common practice defaults (rough): 10 x 8 min + 10 x 15 min = 230 min = 3.83 h -> 4.00 h.
    expect(piecing({})).toBe('4.00');
    expect(DEFAULT_BLOCK_MINUTES).toEqual(expect.objectContaining({ square: 5, rectangles: 8, hst: 12, qst: 15, 'flying-geese': 15, foundation: 25, plate: 90, fan: 45 }));
  });
});
