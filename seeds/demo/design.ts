import Decimal from 'decimal.js';
import type { DesignBody } from '../../shared/src/design/design-body';

/** Exact millimetres of n inches. */
const inch = (n: number) => new Decimal(n).times('25.4').toString();

/**
 * The demo memory quilt's design: twenty 12 in blocks in five rows of four
 * with 2 in navy sashing and calico cornerstones, two borders. Plates of
 * twenty blades cut from every shirt, plain squares that show whole shirt
 * backs, and half-square-triangle blocks with calico.
 * `garments` are the demo's four shirts in seed order, `stock` its studio fabrics by name.
 */
export function demoDesign(garments: number[], stock: { calico: number; navy: number; wadding: number }): DesignBody {
  const [blue, green, polo, stripe] = garments as [number, number, number, number];
  const pattern = ['A', 'B', 'A', 'C', 'C', 'A', 'B', 'A', 'A', 'C', 'A', 'B', 'B', 'A', 'C', 'A', 'A', 'B', 'A', 'C'];
  const squares = [blue, green, stripe, polo, green, stripe];
  const assignments: DesignBody['assignments'] = [
    { target: { kind: 'piece', key: 'block:A:background' }, fabric: { kind: 'stock', stockId: stock.calico } },
    { target: { kind: 'piece', key: 'block:A:centre' }, fabric: { kind: 'stock', stockId: stock.navy } },
    { target: { kind: 'piece', key: 'block:C:light' }, fabric: { kind: 'stock', stockId: stock.calico } },
    { target: { kind: 'piece', key: 'sashing' }, fabric: { kind: 'stock', stockId: stock.navy } },
    { target: { kind: 'piece', key: 'cornerstones' }, fabric: { kind: 'stock', stockId: stock.calico } },
    { target: { kind: 'piece', key: 'border:1' }, fabric: { kind: 'stock', stockId: stock.calico } },
    { target: { kind: 'piece', key: 'border:2' }, fabric: { kind: 'stock', stockId: stock.navy } },
  ];
  let s = 0;
  let c = 0;
  const hstDark = [blue, stripe, green, blue, polo, stripe];
  pattern.forEach((id, index) => {
    if (id === 'B') assignments.push({ target: { kind: 'position', index }, fabric: { kind: 'garment', garmentId: squares[s++ % squares.length]! } });
    if (id === 'C') assignments.push({ target: { kind: 'position', index }, fabric: { kind: 'garment', garmentId: hstDark[c++ % hstDark.length]! } });
  });
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(72), lengthMm: inch(88) },
    layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(12), sashing: { widthMm: inch(2), cornerstones: true }, borders: [inch(2), inch(7)] },
    blocks: [
      { id: 'A', name: 'Shirt plate', kind: 'plate', blades: 20, outerRadiusMm: inch(5), innerRadiusMm: inch(1.5) },
      { id: 'B', name: 'Whole shirt square', kind: 'square' },
      { id: 'C', name: 'Shirt and calico triangles', kind: 'hst', units: 2 },
    ],
    pattern,
    assignments,
    finishing: { bindingStockId: stock.navy, bindingStripMm: inch(2.5), backingStockId: stock.calico, waddingStockId: stock.wadding, prewash: true, shrinkPercent: '3' },
    rules: { minimumPerGarment: 2 },
  };
}
