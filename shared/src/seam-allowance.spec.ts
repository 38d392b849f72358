import { DomainError } from './errors';
import { Length } from './measure';
import { batchesFor, rectangleCut, resolveAllowance, squareCut, stripCut } from './seam-allowance';

const inch = (v: string | number) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('squares, rectangles and strips', () => {
  // common practice (also given in general quilting handbooks): cut = finished + 1/2 in at 1/4 in seams.
  it('cuts a 6 in finished square at 6 1/2 in (common practice)', () => {
    const cut = squareCut(inch(6));
    expect(inches(cut.pieces[0].width.exact)).toBe('6.5');
    expect(inches(cut.pieces[0].width.rounded)).toBe('6.5');
    expect(inches(cut.unfinished!.width)).toBe('6.5');
    expect(cut.pieces[0].piecesEach).toBe(1);
  });

  it('cuts a 12 in finished background square at 12 1/2 in (common practice)', () => {
    expect(inches(squareCut(inch(12)).pieces[0].width.rounded)).toBe('12.5');
  });

  it('cuts a 3 x 6 in rectangle at 3 1/2 x 6 1/2 in and a 2 in strip at 2 1/2 in (common practice)', () => {
    const cut = rectangleCut({ width: inch(3), height: inch(6) });
    expect(inches(cut.pieces[0].width.rounded)).toBe('3.5');
    expect(inches(cut.pieces[0].height.rounded)).toBe('6.5');
    expect(inches(stripCut(inch(2)).rounded)).toBe('2.5');
  });

  it('works with a metric allowance: 10 cm finished at 7.5 mm seams is 11.5 cm (derived: 100 + 2 x 7.5 mm)', () => {
    const cut = squareCut(Length.centimetres(10), { allowance: Length.millimetres('7.5'), ruler: 'millimetre' });
    expect(cut.pieces[0].width.exact.mm.toString()).toBe('115');
    expect(cut.pieces[0].width.rounded.mm.toString()).toBe('115');
  });

  it('rounds a metric cut up to the millimetre (published: 4 in = 101.6 mm, NIST SP 811; derived + 12 mm; rounding step)', () => {
    const cut = squareCut(Length.inches(4), { allowance: Length.millimetres(6), ruler: 'millimetre' });
    expect(cut.pieces[0].width.exact.mm.toString()).toBe('113.6');
    expect(cut.pieces[0].width.rounded.mm.toString()).toBe('114');
  });

  it('counts batches (derived: one square a unit)', () => {
    expect(batchesFor(squareCut(inch(6)), 40)).toBe(40);
  });
});

describe('bad input', () => {
  it.each([
    ['a zero size', () => squareCut(Length.zero), 'not-positive'],
    ['a negative size', () => squareCut(inch(-2)), 'negative'],
    ['a zero allowance', () => squareCut(inch(6), { allowance: Length.zero }), 'not-positive'],
    ['an allowance over 1 in', () => squareCut(inch(6), { allowance: inch('1.25') }), 'allowance-too-large'],
    ['an allowance larger than the piece', () => stripCut(inch('0.25'), { allowance: inch('0.375') }), 'allowance-too-large'],
    ['a NaN size', () => squareCut(inch(Number.NaN)), 'not-a-number'],
  ])('refuses %s', (_label, run, code) => {
    expect(run).toThrow(DomainError);
    expect(run).toThrow(expect.objectContaining({ code }));
  });

  it('says what was expected', () => {
    expect(() => resolveAllowance({ allowance: inch(2) })).toThrow(/at most 1 in/);
  });
});
