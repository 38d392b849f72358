import Decimal from 'decimal.js';
import { DomainError } from './errors';
import { customSize, MATTRESS_PRESETS, mattressPreset, mattressPresets, quiltSizeForBed, TYPICAL_DROP } from './bed-sizes';
import { Length } from './measure';
import { mathjsEvaluate } from './testing/mathjs-units';

const cm = (l: Length) => l.to('cm').toString();
const inches = (l: Length) => l.to('in').toString();

describe('mattress presets', () => {
  it.each([
    // published: UK mattress trade tables (not fixed by law)
    ['uk-small-single', '75', '190'],
    ['uk-single', '90', '190'],
    ['uk-small-double', '120', '190'],
    ['uk-double', '135', '190'],
    ['uk-king', '150', '200'],
    ['uk-super-king', '180', '200'],
    // common practice: UK cot and cot bed
    ['uk-cot', '60', '120'],
    ['uk-cot-bed', '70', '140'],
    // published: EU trade tables, 200 cm long
    ['eu-80', '80', '200'],
    ['eu-140', '140', '200'],
    ['eu-180', '180', '200'],
  ])('%s is %s x %s cm (published UK/EU trade tables; cots common practice)', (id, w, l) => {
    const p = mattressPreset(id);
    expect(cm(p.size.width)).toBe(w);
    expect(cm(p.size.height)).toBe(l);
  });

  it.each([
    // published: US mattress trade tables
    ['us-twin', '38', '75'],
    ['us-full', '54', '75'],
    ['us-queen', '60', '80'],
    ['us-king', '76', '80'],
    ['us-california-king', '72', '84'],
    // published: 16 CFR 1241 full-size crib interior 28 x 52 3/8 in
    ['us-crib', '28', '52.375'],
  ])('%s is %s x %s in (published: US trade tables; crib 16 CFR 1241)', (id, w, l) => {
    const p = mattressPreset(id);
    expect(inches(p.size.width)).toBe(w);
    expect(inches(p.size.height)).toBe(l);
  });

  it('lists presets by region, each naming its source, with unique ids (published: six EU widths)', () => {
    expect(mattressPresets('EU')).toHaveLength(6);
    expect(new Set(MATTRESS_PRESETS.map((p) => p.id)).size).toBe(MATTRESS_PRESETS.length);
    expect(MATTRESS_PRESETS.every((p) => p.source.length > 0)).toBe(true);
    expect(() => mattressPreset('waterbed')).toThrow(DomainError);
  });
});

describe('quiltSizeForBed', () => {
  it('UK double with a 30 cm drop both sides and foot: 195 x 220 cm (derived; mathjs unit sum)', () => {
    const { size } = quiltSizeForBed({ mattress: mattressPreset('uk-double').size, drop: Length.centimetres(30) });
    expect(cm(size.width)).toBe(mathjsEvaluate('135 cm + 2 * 30 cm', 'cm'));
    expect(cm(size.height)).toBe(mathjsEvaluate('190 cm + 30 cm', 'cm'));
  });

  it('US queen, 12 in drop and 10 in pillow tuck: 84 x 102 in (derived; mathjs unit sum)', () => {
    const { size, parts } = quiltSizeForBed({
      mattress: mattressPreset('us-queen').size,
      drop: Length.inches(12),
      pillowTuck: Length.inches(10),
    });
    expect(inches(size.width)).toBe(mathjsEvaluate('60 inch + 2 * 12 inch', 'in'));
    expect(inches(size.height)).toBe(mathjsEvaluate('80 inch + 12 inch + 10 inch', 'in'));
    expect(inches(parts.pillowTuck)).toBe('10');
  });

  it('drops only the exposed sides, bed against a wall (derived; mathjs unit sum)', () => {
    const { size } = quiltSizeForBed({
      mattress: mattressPreset('uk-single').size,
      drop: Length.centimetres(25),
      exposed: { left: false },
    });
    expect(cm(size.width)).toBe(mathjsEvaluate('90 cm + 25 cm', 'cm'));
    expect(cm(size.height)).toBe(mathjsEvaluate('190 cm + 25 cm', 'cm'));
  });

  it('keeps the common-practice drop range of 10 to 16 in', () => {
    expect(inches(TYPICAL_DROP.min)).toBe('10');
    expect(inches(TYPICAL_DROP.max)).toBe('16');
  });

  it('equals mattress + drops + tuck for any input (property of the parts)', () => {
    for (const drop of ['0', '10', '16']) {
      const r = quiltSizeForBed({ mattress: mattressPreset('eu-160').size, drop: Length.inches(drop), pillowTuck: Length.inches(12) });
      expect(r.size.width.eq(r.parts.mattress.width.plus(r.parts.left).plus(r.parts.right))).toBe(true);
      expect(r.size.height.eq(r.parts.mattress.height.plus(r.parts.foot).plus(r.parts.pillowTuck))).toBe(true);
    }
  });

  it('refuses negative drops, huge drops and zero sizes', () => {
    const mattress = mattressPreset('uk-single').size;
    expect(() => quiltSizeForBed({ mattress, drop: Length.inches(-1) })).toThrow(/zero or more/);
    expect(() => quiltSizeForBed({ mattress, drop: Length.metres(2) })).toThrow(/at most 100 cm/);
    expect(() => customSize(Length.zero, Length.inches(new Decimal(30)))).toThrow(DomainError);
  });
});
