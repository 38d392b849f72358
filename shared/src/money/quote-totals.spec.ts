import * as fc from 'fast-check';
import Decimal from 'decimal.js';
import { formatPounds, parsePounds, quoteTotals } from './quote-totals';
import { DomainError } from '../errors';

describe('quote totals', () => {
  // Published: HMRC VAT Notice 700 rounding, worked example as described in HMRC manual VATREC12010:
  // lines of 0.99, 2.49 and 10.03 GBP at 20% give line-rounded VAT of 2.71 against invoice-level VAT of 2.70.
  const hmrcLines = [99, 249, 1003].map((p) => ({ quantity: 1, unitPricePence: p }));

  it('rounds VAT per line to the nearest penny: 2.71 on the HMRC example', () => {
    const t = quoteTotals({ lines: hmrcLines, vatRate: '20', vatMode: 'line', depositPercent: 0 });
    expect(t.lineVatPence).toEqual([20, 50, 201]);
    expect(t.vatPence).toBe(271);
    expect(t.totalPence).toBe(1351 + 271);
  });

  it('rounds VAT on the invoice total down to a whole penny: 2.70 on the HMRC example', () => {
    const t = quoteTotals({ lines: hmrcLines, vatRate: '20', vatMode: 'invoice', depositPercent: 0 });
    expect(t.netPence).toBe(1351);
    expect(t.vatPence).toBe(270);
  });

  it('prices labour, materials and a discount exactly (hand-worked)', () => {
    // Hand-worked: 12.75 h x £35.00 = £446.25; 1.375 yd x £12.00 = £16.50; 2.3 m x £14.50 = £33.35;
    // discount -£20.00; net £476.10; VAT 20% per line 89.25 + 3.30 + 6.67 - 4.00 = £95.22; total £571.32;
    // deposit 30% = £171.396 -> £171.40; balance £399.92.
    const t = quoteTotals({
      lines: [
        { quantity: '12.75', unitPricePence: 3500 },
        { quantity: '1.375', unitPricePence: 1200 },
        { quantity: '2.3', unitPricePence: 1450 },
        { quantity: 1, unitPricePence: -2000 },
      ],
      vatRate: '20',
      vatMode: 'line',
      depositPercent: 30,
    });
    expect(t.lineNetPence).toEqual([44625, 1650, 3335, -2000]);
    expect(t.netPence).toBe(47610);
    expect(t.lineVatPence).toEqual([8925, 330, 667, -400]);
    expect(t.vatPence).toBe(9522);
    expect(t.totalPence).toBe(57132);
    expect(t.depositPence).toBe(17140);
    expect(t.balancePence).toBe(39992);
  });

  it('charges no VAT when the studio is not registered, and 5% or 0% when chosen (gov.uk VAT rates)', () => {
    const lines = [{ quantity: 1, unitPricePence: 10000 }];
    expect(quoteTotals({ lines, vatRate: null, vatMode: 'line', depositPercent: 25 })).toMatchObject({ vatPence: 0, totalPence: 10000, depositPence: 2500 });
    expect(quoteTotals({ lines, vatRate: '5', vatMode: 'invoice', depositPercent: 0 }).vatPence).toBe(500);
    expect(quoteTotals({ lines, vatRate: '0', vatMode: 'invoice', depositPercent: 0 }).vatPence).toBe(0);
  });

  it('never loses or invents a penny: deposit + balance = total = net + VAT', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ quantity: fc.integer({ min: 1, max: 4000 }).map((q) => new Decimal(q).dividedBy(4).toString()), unitPricePence: fc.integer({ min: 0, max: 500000 }) }), { minLength: 1, maxLength: 20 }),
        fc.constantFrom('20', '5', '0', null),
        fc.constantFrom('line', 'invoice'),
        fc.integer({ min: 0, max: 100 }),
        (lines, vatRate, vatMode, depositPercent) => {
          const t = quoteTotals({ lines, vatRate: vatRate as '20' | null, vatMode: vatMode as 'line', depositPercent });
          expect(t.depositPence + t.balancePence).toBe(t.totalPence);
          expect(t.netPence + t.vatPence).toBe(t.totalPence);
          expect(Number.isInteger(t.vatPence) && Number.isInteger(t.depositPence)).toBe(true);
          // Invoice-level VAT rounds down, so it is never more than the exact VAT.
          if (vatMode === 'invoice' && vatRate) expect(t.vatPence).toBeLessThanOrEqual((t.netPence * Number(vatRate)) / 100);
        },
      ),
    );
  });

  it('refuses bad input with a typed error', () => {
    expect(() => quoteTotals({ lines: [{ quantity: 0, unitPricePence: 100 }], vatRate: '20', vatMode: 'line', depositPercent: 0 })).toThrow(DomainError);
    expect(() => quoteTotals({ lines: [{ quantity: 'abc', unitPricePence: 100 }], vatRate: '20', vatMode: 'line', depositPercent: 0 })).toThrow(/number/);
    expect(() => quoteTotals({ lines: [{ quantity: 1, unitPricePence: 100 }], vatRate: '20', vatMode: 'line', depositPercent: 101 })).toThrow(/0 to 100/);
    expect(() => quoteTotals({ lines: [{ quantity: 1, unitPricePence: -100 }], vatRate: null, vatMode: 'line', depositPercent: 0 })).toThrow(/below zero/);
  });

  it('formats and reads amounts in pounds', () => {
    expect(formatPounds(123456)).toBe('\u00a31,234.56');
    expect(formatPounds(5)).toBe('\u00a30.05');
    expect(parsePounds('£1,200.5')).toBe(120050);
    expect(parsePounds('12.345')).toBeNull();
    expect(parsePounds('abc')).toBeNull();
  });
});
