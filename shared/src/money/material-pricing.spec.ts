import { Length } from '../measure';
import { priceLength } from './material-pricing';

describe('a studio fabric priced from stock in shop steps', () => {
  it('rounds a length priced by the metre up to whole 10 cm steps (common practice)', () => {
    // Hand-worked: 1234 mm is 12.34 tenths of a metre, up to 13 steps = 1.3 m.
    expect(priceLength(Length.millimetres(1234), { costPence: 1450, costUnit: 'metre' })).toEqual({ quantity: '1.3', unit: 'm', increment: '10 cm', unitPricePence: 1450 });
    // A length on a step stays on it: 2 m.
    expect(priceLength(Length.centimetres(200), { costPence: 1450, costUnit: 'metre' })!.quantity).toBe('2');
  });

  it('rounds a length priced by the yard up to whole 1/4 yd steps (common practice); 1 yd = 914.4 mm (NIST SP 811 appendix B)', () => {
    // Hand-worked: 1 yd and 1 mm is just over 4 quarters, so 5 quarters = 1.25 yd.
    expect(priceLength(Length.millimetres('915.4'), { costPence: 1100, costUnit: 'yard' })).toEqual({ quantity: '1.25', unit: 'yd', increment: '1/4 yd', unitPricePence: 1100 });
    // A fat quarter's 18 in is exactly half a yard.
    expect(priceLength(Length.inches(18), { costPence: 1100, costUnit: 'yard' })!.quantity).toBe('0.5');
    // A scrap of 3 in is still one whole step.
    expect(priceLength(Length.inches(3), { costPence: 1100, costUnit: 'yard' })!.quantity).toBe('0.25');
  });

  it('keeps a missing cost as null, and gives nothing for no length', () => {
    expect(priceLength(Length.centimetres(50), { costPence: null, costUnit: 'metre' })!.unitPricePence).toBeNull();
    expect(priceLength(Length.zero, { costPence: 900, costUnit: 'metre' })).toBeNull();
  });
});
