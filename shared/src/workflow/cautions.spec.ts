import { cautionsFor, featuresToRemove } from './cautions';

describe('cautions by age group', () => {
  it('gives a baby under 12 months the safe-sleep notice (AAP 2022 safe-sleep policy; UK NHS guidance)', () => {
    expect(cautionsFor('baby_under_1').map((c) => c.code)).toEqual(['safe_sleep', 'small_parts', 'prewash_required']);
  });

  it('flags small parts for a child under 3 (US 16 CFR 1501) but not safe sleep', () => {
    expect(cautionsFor('child_under_3').map((c) => c.code)).toEqual(['small_parts', 'prewash_required']);
  });

  it('adds nothing for older children and adults', () => {
    expect(cautionsFor('child')).toEqual([]);
    expect(cautionsFor('adult')).toEqual([]);
  });

  it('flags kept buttons for removal only on pieces for young children', () => {
    const features = [
      { kind: 'buttons' as const, position: 'front placket' },
      { kind: 'pocket' as const, position: 'left chest' },
      { kind: 'other' as const, position: 'bead trim at hem' },
    ];
    expect(featuresToRemove('child_under_3', features).map((f) => f.position)).toEqual(['front placket', 'bead trim at hem']);
    expect(featuresToRemove('adult', features)).toEqual([]);
  });
});
