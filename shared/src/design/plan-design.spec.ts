import Decimal from 'decimal.js';
import { deriveDesign } from './derive-design';
import { cutPlanInput, planDesign, type PanelFeature } from './plan-design';
import { planCuts } from '../cut-plan/cut-plan';
import { checkPlan } from '../cut-plan/plan-checker';
import { POCKET as pocket, flannelShirt as shirt, inch, squaresDesign as squares } from '../testing/design-fixtures';

const mm = (n: number) => new Decimal(n).times('25.4').toNumber();

describe('planDesign: kept features held whole in a block piece', () => {
  it('pins one plain square centred on the pocket, and the plan cuts the pocket whole inside it', () => {
    const body = squares(8);
    const derived = deriveDesign(body);
    const input = cutPlanInput(body, derived, shirt(12));
    const square = derived.pieces.find((p) => p.key === 'block:B:square')!;
    expect(square.count).toBe(4);
    // One of the four 8 1/2 in squares (8 in finished + 1/4 in each side, common practice) is taken for the pocket.
    expect(input.pieces.find((p) => p.id === square.id)!.count).toBe(3);
    const pinned = input.pieces.filter((p) => p.keptFeature);
    expect(pinned).toEqual([
      expect.objectContaining({ id: `${square.id}@panel-31-feature-1`, count: 1, width: mm(8.5), height: mm(8.5), keptFeature: { featureId: 'panel-31-feature-1', placement: 'centred' } }),
    ]);
    expect(input.panels[0]!.features).toEqual([{ id: 'panel-31-feature-1', x: mm(2), y: mm(4), width: mm(5), height: mm(5.5), label: 'breast pocket' }]);

    // The planner's plan passes the independent checker (kept features whole, centred within 0.002).
    const plan = planCuts(input);
    expect(checkPlan(input, plan)).toEqual([]);
    const around = plan.placements.find((pl) => pl.featureId === 'panel-31-feature-1')!;
    expect(around).toMatchObject({ panelId: 'panel-31', garmentId: '7' });
    // Derived: centred, the pocket leaves (8.5 - 5) / 2 = 1.75 in each side and (8.5 - 5.5) / 2 = 1.5 in above and below,
    // so the square starts 2 - 1.75 = 0.25 in from the left and 4 - 1.5 = 2.5 in from the top.
    expect(around.x).toBeCloseTo(mm(0.25), 2);
    expect(around.y).toBeCloseTo(mm(2.5), 2);
    // Whole inside the piece and clear of its 1/4 in seam allowances.
    const seam = mm(0.25);
    expect(around.x + seam).toBeLessThanOrEqual(mm(2));
    expect(around.y + seam).toBeLessThanOrEqual(mm(4));
    expect(around.x + around.width - seam).toBeGreaterThanOrEqual(mm(7));
    expect(around.y + around.height - seam).toBeGreaterThanOrEqual(mm(9.5));
  });

  it('reports the plan in the design\'s own pieces: the kept square is the last copy, marked with its feature', () => {
    const body = squares(8);
    const derived = deriveDesign(body);
    const summary = planDesign(body, derived, shirt(12));
    const square = derived.pieces.find((p) => p.key === 'block:B:square')!;
    const copies = summary.plan.placements.filter((pl) => pl.pieceId === square.id);
    expect(copies.map((pl) => pl.copy).sort()).toEqual([1, 2, 3, 4]);
    expect(copies.find((pl) => pl.copy === 4)!.featureId).toBe('panel-31-feature-1');
    expect(summary.plan.placements.every((pl) => derived.pieces.some((p) => p.id === pl.pieceId))).toBe(true);
    const cutPieces = summary.plan.panels.flatMap((pp) => pp.cuts.flatMap((c) => [c.cutsOff, c.remaining])).filter((r) => r.content === 'piece');
    expect(cutPieces.every((r) => r.pieceId === square.id)).toBe(true);
    expect(summary.shortfall).toEqual([]);
    expect(summary.totals).toMatchObject({ piecesRequested: 4, piecesPlaced: 4, piecesShort: 0 });
    expect(summary.garments[0]!.uses).toEqual([{ pieceId: square.id, label: square.label, count: 4 }]);
  });

  it('reports a block too large for the pocket\'s panel, naming the panel, with what to do', () => {
    // A 12 in block cuts 12 1/2 in: more than the 10 in wide left front.
    const body = squares(12);
    const derived = deriveDesign(body);
    const summary = planDesign(body, derived, shirt(10));
    const square = derived.pieces.find((p) => p.key === 'block:B:square')!;
    const kept = summary.shortfall.filter((s) => s.pieceId.includes('@'));
    expect(kept).toEqual([
      {
        pieceId: `${square.id}@panel-31-feature-1`,
        label: `${square.label}, kept around the breast pocket (Green flannel shirt, left front)`,
        count: 1,
        reason: 'no-panel-large-enough',
        detail: 'the piece is larger than panel "Green flannel shirt, left front"',
        remedies: [
          'Choose a smaller block size, so a block centred on the feature fits inside its panel.',
          'Or take the kept feature off the panel, and the block is cut like any other.',
        ],
      },
    ]);
    // In the stored plan the short copy is the design's own piece.
    expect(summary.plan.shortfall.pieces.filter((s) => s.reason === 'no-panel-large-enough')).toEqual([
      expect.objectContaining({ pieceId: square.id, count: 1, detail: 'the piece is larger than panel "panel-31"' }),
    ]);
  });

  it('reports a pocket no block piece can hold, and takes no piece for it', () => {
    // A 4 in block is 4 in inside its seam allowances, less than the 5 x 5 1/2 in pocket.
    const body = squares(4);
    const derived = deriveDesign(body);
    const input = cutPlanInput(body, derived, shirt(12));
    expect(input.pieces.some((p) => p.keptFeature)).toBe(false);
    const summary = planDesign(body, derived, shirt(12));
    const square = derived.pieces.find((p) => p.key === 'block:B:square')!;
    expect(summary.shortfall).toEqual([
      {
        pieceId: '@panel-31-feature-1',
        label: 'Kept feature: the breast pocket (Green flannel shirt, left front)',
        count: 1,
        reason: 'no-piece-large-enough',
        detail: `the breast pocket is 5 in x 5 1/2 in, larger than every block piece that may come from this garment: the largest, ${square.label}, is 4 in x 4 in inside its seam allowances`,
        remedies: [
          'Choose a larger block size, or a plain-square block cut from this garment, so one block holds the feature whole.',
          'Or take the kept feature off the panel, and the block is cut like any other.',
        ],
      },
    ]);
  });

  it('does not cut a kept feature into triangles, nor take a piece meant for another garment', () => {
    const triangles = squares(8, 2, 2, { blocks: [{ id: 'C', name: 'Triangles', kind: 'hst', units: 2 }], pattern: ['C'] });
    const onlyTriangles = planDesign(triangles, deriveDesign(triangles), shirt(12));
    expect(onlyTriangles.shortfall.filter((s) => s.pieceId.startsWith('@')).map((s) => s.detail)).toEqual([
      'the breast pocket (5 in x 5 1/2 in) needs a block piece shown whole, and the design has no plain-square or rail block that may be cut from this garment',
    ]);
    const elsewhere = squares(8, 1, 1, { assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: 99 } }] });
    expect(cutPlanInput(elsewhere, deriveDesign(elsewhere), shirt(12)).pieces.some((p) => p.keptFeature)).toBe(false);
  });

  it('gives each feature its own piece, and says so when there are not enough', () => {
    const label: PanelFeature = { name: 'maker\'s label', xMm: inch(2), yMm: inch(14), widthMm: inch(2), heightMm: inch(1) };
    const one = squares(8, 1, 1);
    const summary = planDesign(one, deriveDesign(one), shirt(12, [pocket, label]));
    expect(summary.plan.placements.map((pl) => pl.featureId)).toEqual(['panel-31-feature-1']);
    expect(summary.shortfall.map((s) => [s.pieceId, s.detail])).toEqual([
      ['@panel-31-feature-2', 'every block piece that could hold the maker\'s label is already kept around another feature'],
    ]);
  });
});
