import * as api from './index';

describe('public API', () => {
  it('exports the maths from one place', () => {
    for (const name of [
      'Length',
      'parseLength',
      'formatInches',
      'roundUpToEighth',
      'roundToNearestEighth',
      'squareCut',
      'halfSquareTriangleCut',
      'quarterSquareTriangleCut',
      'flyingGeeseCut',
      'equilateralTriangleCut',
      'sideSettingTriangleCut',
      'cornerSettingTriangleCut',
      'quiltSizeForBed',
      'cushionCover',
      'gridLayout',
      'onPointLayout',
      'suggestGrid',
      'topSizeForTarget',
      'dimensionalChangePercent',
      'wedgeBlock',
      'bladeStrips',
      'centreCircle',
      'backgroundSquare',
      'foundationBlock',
      'yardage',
      'straightBinding',
      'biasBindingSquare',
      'backing',
      'wadding',
      'DomainError',
      'MeasureError',
      'reviveLengths',
    ]) {
      expect(typeof (api as Record<string, unknown>)[name]).toBe('function');
    }
  });

  it('gives design results a JSON form that revives to equal lengths', () => {
    const layout = api.gridLayout({ rows: 2, columns: 3, block: api.parseLength('12'), borders: [api.parseLength('4 in')] });
    const back = JSON.parse(JSON.stringify(layout), api.reviveLengths) as api.GridLayout;
    expect(back.finished.width).toBeInstanceOf(api.Length);
    expect(back.finished.width.eq(layout.finished.width)).toBe(true);
    expect(back.borders[0].topAndBottom.cut.length.rounded.eq(layout.borders[0].topAndBottom.cut.length.rounded)).toBe(true);
  });
});
