// Small designs and garments the design specs share: a top of plain squares,
// and a flannel shirt whose left front carries a breast pocket to keep whole.

import Decimal from 'decimal.js';
import type { DesignBody } from '../design/design-body';
import type { DesignSources, PanelFeature } from '../design/plan-design';

/** Exact millimetres of n inches, as a decimal string. */
export const inch = (n: number) => new Decimal(n).times('25.4').toString();

/** A small top of plain squares ("B"): rows x columns blocks of `block` in, no sashing, borders or groups. */
export function squaresDesign(block = 8, rows = 2, columns = 2, over: Partial<DesignBody> = {}): DesignBody {
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(block * columns), lengthMm: inch(block * rows) },
    layout: { setting: 'straight', rows, columns, blockMm: inch(block), sashing: null, borders: [] },
    blocks: [{ id: 'B', name: 'Whole shirt square', kind: 'square' }],
    pattern: ['B'],
    groups: [],
    assignments: [],
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
    rules: { minimumPerGarment: 0 },
    ...over,
  };
}

/** A breast pocket 2 in from the left and 4 in from the top of its panel, 5 x 5 1/2 in. */
export const POCKET: PanelFeature = { name: 'breast pocket', xMm: inch(2), yMm: inch(4), widthMm: inch(5), heightMm: inch(5.5) };

/** One shirt, garment 7: a left front (panel 31) of `width` x 24 in holding the features, and a 22 x 27 in back (panel 32). */
export function flannelShirt(width = 12, features: PanelFeature[] = [POCKET]): DesignSources {
  return {
    garments: [
      {
        id: 7,
        description: 'Green flannel shirt',
        colour: 'green',
        fibre: 'flannel',
        construction: 'woven',
        print: 'non_directional',
        panels: [
          { id: 31, name: 'left front', widthMm: inch(width), heightMm: inch(24), grain: 'vertical', features },
          { id: 32, name: 'back', widthMm: inch(22), heightMm: inch(27), grain: 'vertical', features: [] },
        ],
      },
    ],
    stock: [],
  };
}
