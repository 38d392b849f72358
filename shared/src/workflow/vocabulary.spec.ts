import { FIBRE, GRAIN, fibreLine, fibreName } from './vocabulary';

describe('vocabularies', () => {
  it('offer their values with labels, in order, for a select', () => {
    expect(GRAIN.options).toEqual([
      { value: 'vertical', label: 'Runs along the height' },
      { value: 'horizontal', label: 'Runs along the width' },
    ]);
    expect(FIBRE.options.map((o) => o.value)).toEqual(FIBRE.values);
    expect(FIBRE.options.find((o) => o.value === 'knit_jersey')?.label).toBe('Knit jersey');
  });

  it('name a fibre for the care card, saying when it is not known', () => {
    expect(fibreName('knit_jersey')).toBe('Knit jersey');
    expect(fibreName('unknown')).toBe('Fibre not known');
  });

  it('list what of one fibre went in: the garments, then the studio fabrics', () => {
    expect(fibreLine({ garments: ['Blue shirt', 'Check shirt'], studio: ['Navy binding cotton'] })).toBe('Blue shirt, Check shirt; Navy binding cotton (studio fabric)');
    expect(fibreLine({ garments: ['Blue shirt'], studio: [] })).toBe('Blue shirt');
    expect(fibreLine({ garments: [], studio: ['Unbleached calico', 'Navy cotton'] })).toBe('Unbleached calico, Navy cotton (studio fabrics)');
  });
});
