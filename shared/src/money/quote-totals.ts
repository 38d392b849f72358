import Decimal from 'decimal.js';
import { DomainError } from '../errors';

/**
 * Quote arithmetic in pence, exactly. A line is quantity x unit price; its net
 * amount is rounded half-up to the penny. VAT follows HMRC's rules as set out
 * in VAT Notice 700 (HMRC manual VATREC12010): either worked per line, each
 * line's VAT rounded to the nearest penny, or worked on the invoice total and
 * rounded down to a whole penny.
 */
export type VatMode = 'line' | 'invoice';
export type VatRate = '20' | '5' | '0';
export const VAT_RATES = ['20', '5', '0'] as const satisfies readonly VatRate[];

export interface QuoteLineInput {
  /** Hours, metres, yards, items: any exact decimal. */
  quantity: Decimal.Value;
  /** Price of one unit in pence (may be fractional, e.g. 1250.5). Negative for a discount. */
  unitPricePence: Decimal.Value;
}

export interface QuoteTotalsInput {
  lines: readonly QuoteLineInput[];
  /** Null when the studio is not VAT registered. */
  vatRate: VatRate | null;
  vatMode: VatMode;
  /** 0 to 100. */
  depositPercent: Decimal.Value;
}

export interface QuoteTotals {
  /** Net of each line, in whole pence. */
  lineNetPence: number[];
  /** VAT of each line in whole pence (line mode), else zeros. */
  lineVatPence: number[];
  netPence: number;
  vatPence: number;
  totalPence: number;
  depositPence: number;
  balancePence: number;
}

const toPence = (d: Decimal, mode: Decimal.Rounding) => d.toDecimalPlaces(0, mode).toNumber();

function decimal(value: Decimal.Value, field: string): Decimal {
  let d: Decimal;
  try {
    d = new Decimal(value);
  } catch {
    throw new DomainError('not-a-number', `Expected ${field} to be a number.`, field);
  }
  if (!d.isFinite()) throw new DomainError('not-finite', `Expected ${field} to be a finite number.`, field);
  if (d.abs().gt(1e10)) throw new DomainError('too-large', `Expected ${field} to be smaller.`, field);
  return d;
}

export function quoteTotals(input: QuoteTotalsInput): QuoteTotals {
  const deposit = decimal(input.depositPercent, 'depositPercent');
  if (deposit.lt(0) || deposit.gt(100)) throw new DomainError('out-of-range', 'Expected the deposit to be 0 to 100 percent.', 'depositPercent');
  const rate = input.vatRate === null ? new Decimal(0) : new Decimal(input.vatRate).dividedBy(100);

  const lineNet = input.lines.map((l, i) => {
    const q = decimal(l.quantity, `lines.${i}.quantity`);
    if (q.lte(0)) throw new DomainError('not-positive', `Expected the quantity of line ${i + 1} to be more than 0.`, `lines.${i}.quantity`);
    return toPence(q.times(decimal(l.unitPricePence, `lines.${i}.unitPricePence`)), Decimal.ROUND_HALF_UP);
  });
  const netPence = lineNet.reduce((a, b) => a + b, 0);

  let lineVat = lineNet.map(() => 0);
  let vatPence: number;
  if (input.vatMode === 'line') {
    lineVat = lineNet.map((n) => toPence(new Decimal(n).times(rate), Decimal.ROUND_HALF_UP));
    vatPence = lineVat.reduce((a, b) => a + b, 0);
  } else {
    vatPence = toPence(new Decimal(netPence).times(rate), Decimal.ROUND_DOWN);
  }
  const totalPence = netPence + vatPence;
  if (totalPence < 0) throw new DomainError('negative', 'The discount is larger than the quote: the total would be below zero.', 'lines');
  const depositPence = toPence(new Decimal(totalPence).times(deposit).dividedBy(100), Decimal.ROUND_HALF_UP);
  return { lineNetPence: lineNet, lineVatPence: lineVat, netPence, vatPence, totalPence, depositPence, balancePence: totalPence - depositPence };
}

/** "£1,234.56" from pence. */
export function formatPounds(pence: number): string {
  const sign = pence < 0 ? '-' : '';
  const abs = new Decimal(Math.abs(pence)).dividedBy(100).toFixed(2);
  const [whole, frac] = abs.split('.');
  return `${sign}\u00a3${whole!.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}.${frac}`;
}

/** Pence from a typed amount in pounds ("12.5", "£1,200.00"); null when it is not an amount. */
export function parsePounds(text: string): number | null {
  const cleaned = text.trim().replace(/^£/, '').replace(/,/g, '');
  if (!/^-?\d+(\.\d{1,2})?$/.test(cleaned)) return null;
  return new Decimal(cleaned).times(100).toNumber();
}
