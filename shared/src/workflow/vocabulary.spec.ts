import { FIBRE, GRAIN } from './vocabulary';

describe('vocabularies', () => {
  it('offer their values with labels, in order, for a select', () => {
    expect(GRAIN.options).toEqual([
      { value: 'vertical', label: 'Runs along the height' },
      { value: 'horizontal', label: 'Runs along the width' },
    ]);
    expect(FIBRE.options.map((o) => o.value)).toEqual(FIBRE.values);
    expect(FIBRE.options.find((o) => o.value === 'knit_jersey')?.label).toBe('Knit jersey');
  });
});
