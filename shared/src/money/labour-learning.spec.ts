import Decimal from 'decimal.js';
import { compareHours, learnedHours, learnedRatios, mainBlockKind, median, type FinishedCommission } from './labour-learning';
import { deriveDesign } from '../design/derive-design';
import { squaresDesign } from '../testing/design-fixtures';

describe('quoted against logged hours', () => {
  // The trial: 18.25 h quoted at £30, 21.5 h logged.
  const labour = [
    { stage: 'preparation', quantity: '3.00', unitPricePence: 3000 },
    { stage: 'piecing', quantity: '10.00', unitPricePence: 3000 },
    { stage: 'quilting', quantity: '4.00', unitPricePence: 3000 },
    { stage: 'binding', quantity: '1.25', unitPricePence: 3000 },
  ];
  const logged = [
    { stage: 'piecing', hours: '7.5' },
    { stage: 'preparation', hours: '2.5' },
    { stage: 'piecing', hours: '5' },
    { stage: 'quilting', hours: '4.5' },
    { stage: 'binding', hours: '1' },
    { stage: 'cutting', hours: '1' },
  ];
  const c = compareHours(labour, logged, 3000);

  it('shows each stage in the order of the work, with the hours quoted, logged and the difference', () => {
    expect(c.stages.map((s) => [s.stage, s.quotedHours, s.loggedHours, s.differenceHours])).toEqual([
      ['preparation', '3.00', '2.50', '-0.50'],
      ['cutting', '0.00', '1.00', '1.00'],
      ['piecing', '10.00', '12.50', '2.50'],
      ['quilting', '4.00', '4.50', '0.50'],
      ['binding', '1.25', '1.00', '-0.25'],
    ]);
    // Hand-worked: 3 + 10 + 4 + 1.25 = 18.25 quoted; 2.5 + 1 + 12.5 + 4.5 + 1 = 21.5 logged.
    expect(c.total).toMatchObject({ quotedHours: '18.25', loggedHours: '21.50', differenceHours: '3.25' });
  });

  it('works the margin as the quoted labour less the logged hours at the rate, in pence', () => {
    // Hand-worked: piecing 10 h x £30 = £300 quoted, 12.5 h x £30 = £375 worked: -£75.
    expect(c.stages.find((s) => s.stage === 'piecing')).toMatchObject({ quotedPence: 30000, loggedCostPence: 37500, marginPence: -7500 });
    // 18.25 x £30 = £547.50 against 21.5 x £30 = £645: -£97.50.
    expect(c.total).toMatchObject({ quotedPence: 54750, loggedCostPence: 64500, marginPence: -9750 });
  });

  it('keeps labour lines that name no stage on a row of their own', () => {
    const loose = compareHours([{ stage: null, quantity: '2', unitPricePence: '2500.5' }], [], 3000);
    // Hand-worked: 2 x 2500.5 = 5001 pence.
    expect(loose.stages).toEqual([{ stage: null, quotedHours: '2.00', loggedHours: '0.00', differenceHours: '-2.00', quotedPence: 5001, loggedCostPence: 0, marginPence: 5001 }]);
  });
});

describe('the labour estimate learned from finished commissions', () => {
  const done = (id: number, kind: string, quoted: string, loggedHours: string): FinishedCommission => ({
    commissionId: id,
    finishedAt: `2026-${String(id).padStart(2, '0')}-01T12:00:00Z`,
    blockKind: kind,
    stages: { piecing: { quotedHours: quoted, loggedHours } },
  });

  it('takes the median of logged / quoted over the last ten of the same block kind (worked example)', () => {
    // Twelve finished plate commissions, ratios (oldest first): 3, 3, then 1.0, 1.1, 1.2, 1.15, 1.25, 1.3, 1.18, 1.18, 0.9, 1.4.
    const ratios = ['3', '3', '1.0', '1.1', '1.2', '1.15', '1.25', '1.3', '1.18', '1.18', '0.9', '1.4'];
    const history = ratios.map((r, i) => done(i + 1, 'plate', '10', new Decimal(r).times(10).toString()));
    const [piecing] = learnedRatios(history, 'plate', ['piecing']);
    // Hand-worked: the two oldest (3, 3) fall outside the last ten; the ten sorted are
    // 0.9 1.0 1.1 1.15 1.18 1.18 1.2 1.25 1.3 1.4, median (1.18 + 1.18) / 2 = 1.18.
    expect(piecing).toEqual({ stage: 'piecing', ratio: '1.18', commissions: 10, blockKind: 'plate', basis: 'from 10 finished commissions of plate blocks: logged 1.18\u00d7 quoted for piecing' });
    expect(learnedHours('16.00', piecing!.ratio)).toBe('19.00'); // 16 x 1.18 = 18.88 -> 19.00
  });

  it('falls back to every block kind when fewer than three share it, and says so', () => {
    const history = [done(1, 'hst', '10', '12'), done(2, 'hst', '10', '11'), done(3, 'square', '10', '10'), done(4, 'plate', '10', '15')];
    const [piecing] = learnedRatios(history, 'plate', ['piecing']);
    // Hand-worked: ratios 1.2, 1.1, 1.0, 1.5; median (1.1 + 1.2) / 2 = 1.15.
    expect(piecing).toMatchObject({ ratio: '1.15', commissions: 4, blockKind: null, basis: 'from 4 finished commissions: logged 1.15\u00d7 quoted for piecing' });
  });

  it('learns nothing from fewer than three, nor from a stage with no hours logged', () => {
    expect(learnedRatios([done(1, 'plate', '10', '12'), done(2, 'plate', '10', '13')], 'plate', ['piecing'])).toEqual([]);
    expect(learnedRatios([done(1, 'plate', '10', '0'), done(2, 'plate', '10', '0'), done(3, 'plate', '10', '0')], 'plate', ['piecing'])).toEqual([]);
  });

  it('takes the middle of an odd count and the mean of the two middles of an even one', () => {
    expect(median(['3', '1', '2'].map((v) => new Decimal(v))).toString()).toBe('2');
    expect(median(['4', '1', '2', '3'].map((v) => new Decimal(v))).toString()).toBe('2.5');
  });

  it("reads a design's main block kind from its positions", () => {
    // Hand-counted: a 2 x 3 top patterned plate, square, square... gives 2 plates and 4 squares.
    const body = squaresDesign(12, 2, 3, {
      blocks: [
        { id: 'A', name: 'Plate', kind: 'plate', blades: 20, outerRadiusMm: '127', innerRadiusMm: '38.1' },
        { id: 'B', name: 'Square', kind: 'square' },
      ],
      pattern: ['A', 'B', 'B'],
    });
    expect(mainBlockKind(body, deriveDesign(body))).toBe('square');
    expect(mainBlockKind({ ...body, pattern: ['A'] }, deriveDesign({ ...body, pattern: ['A'] }))).toBe('plate');
  });
});
