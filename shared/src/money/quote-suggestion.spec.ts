import Decimal from 'decimal.js';
import { deriveDesign } from '../design/derive-design';
import { planDesign, type DesignPlanSummary } from '../design/plan-design';
import type { DesignBody } from '../design/design-body';
import { DEFAULT_BLOCK_MINUTES, quarterHours, suggestQuoteLines } from './quote-suggestion';

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
  const lines = suggestQuoteLines({
    body,
    derived,
    plan,
    stock: [
      { id: 1, name: 'Wide backing', costPence: 1450, costUnit: 'metre' },
      { id: 2, name: 'Navy cotton', costPence: 1100, costUnit: 'yard' },
    ],
    hourlyRatePence: 3000,
    blockMinutes: { plate: 90, square: 6 },
    knitGarments: 1,
    garments: 4,
  });
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

  it('prices studio fabric to buy by its own unit, at its own price', () => {
    const backing = lines.find((l) => l.description.startsWith('Wide backing'))!;
    const shop = plan.shopping.find((s) => s.stockId === 1)!;
    expect(backing).toMatchObject({ kind: 'material', unit: 'm', unitPricePence: 1450 });
    // Derived: millimetres to buy / 1000, rounded up to 4 decimals.
    expect(backing.quantity).toBe(new Decimal(shop.buyMm).dividedBy(1000).toDecimalPlaces(4, Decimal.ROUND_UP).toString());
    const navy = lines.find((l) => l.description.startsWith('Navy cotton'))!;
    const navyShop = plan.shopping.find((s) => s.stockId === 2)!;
    // 1 yd = 914.4 mm exactly (NIST SP 811 appendix B).
    expect(navy).toMatchObject({ unit: 'yd', unitPricePence: 1100 });
    expect(new Decimal(navy.quantity).times('914.4').gte(navyShop.buyMm)).toBe(true);
  });

  it('asks for stabiliser for knit garments, wadding, thread and a label, priced by the maker', () => {
    expect(lines.find((l) => l.description.startsWith('Fusible stabiliser'))).toMatchObject({ quantity: '1', unitPricePence: 0 });
    // Wadding 4 in larger than the 48 x 60 in top on every side (common practice): 56 x 68 in = 142.24 x 172.72 cm, up to whole cm.
    expect(lines.find((l) => l.description.startsWith('Wadding'))).toMatchObject({ description: 'Wadding, 143 x 173 cm', unitPricePence: 0 });
    expect(lines.map((l) => l.description)).toEqual(expect.arrayContaining(['Thread for piecing and quilting', 'Sewn-in label']));
  });

  it('rounds hours up to the quarter, never below a quarter', () => {
    expect([0.01, 0.25, 0.26, 2.787, 0].map(quarterHours)).toEqual(['0.25', '0.25', '0.50', '3.00', '0.25']);
  });

  it("reads the studio's minutes under each block kind's own key, and each kind's default when the studio has none", () => {
    const rails: DesignBody = { ...body, blocks: [{ id: 'A', name: 'Rails', kind: 'rectangles', units: 3 }, { id: 'B', name: 'Geese', kind: 'flying-geese', units: 2 }] };
    const derivedRails = deriveDesign(rails);
    const piecing = (blockMinutes: Record<string, number>) =>
      suggestQuoteLines({ body: rails, derived: derivedRails, plan: planDesign(rails, derivedRails, { garments: [], stock: [] }), stock: [], hourlyRatePence: 3000, blockMinutes, knitGarments: 0, garments: 0 }).find((l) => l.stage === 'piecing')!.quantity;
    // Hand-worked: 10 rail blocks x 12 min + 10 geese blocks x 30 min = 420 min = 7 h.
    expect(piecing({ rectangles: 12, 'flying-geese': 30 })).toBe('7.00');
    // Common practice defaults (rough): 10 x 8 min + 10 x 15 min = 230 min = 3.83 h -> 4.00 h.
    expect(piecing({})).toBe('4.00');
    expect(DEFAULT_BLOCK_MINUTES).toEqual(expect.objectContaining({ square: 5, rectangles: 8, hst: 12, qst: 15, 'flying-geese': 15, foundation: 25, plate: 90, fan: 45 }));
  });
});
