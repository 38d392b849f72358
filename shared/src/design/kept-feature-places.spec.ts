import { deriveDesign } from './derive-design';
import { designDrawing, keptFeatureOutline } from './design-drawing';
import type { DesignBody } from './design-body';
import { planDesign, type PanelFeature } from './plan-design';
import { keptFeatureLabel, keptFeatureNote, keptFeaturePieces, keptFeaturePlaces } from './kept-feature-places';
import { POCKET as pocket, flannelShirt, inch, squaresDesign } from '../testing/design-fixtures';

const label: PanelFeature = { name: "maker's label", xMm: inch(2), yMm: inch(14), widthMm: inch(2), heightMm: inch(1) };
const top = (over: Partial<DesignBody> = {}) => squaresDesign(8, 2, 2, over);
const shirt = (features: PanelFeature[]) => flannelShirt(12, features);

describe('kept features: which piece holds them and where it goes', () => {
  it('lists the kept feature with the copy cut around it, and words it for the cut list and the drawing', () => {
    const body = top();
    const derived = deriveDesign(body);
    const summary = planDesign(body, derived, shirt([pocket]));
    const square = derived.pieces.find((p) => p.key === 'block:B:square')!;
    // The kept copy is the last of the four squares (plan-design.ts).
    expect(summary.keptFeatures).toEqual([{ featureId: 'panel-31-feature-1', feature: 'breast pocket', garmentId: 7, garment: 'Green flannel shirt', panel: 'left front', pieceId: square.id, copy: 4 }]);
    const [place] = keptFeaturePlaces(body, derived, keptFeaturePieces(summary));
    // Copy 4 of the one square piece used by all four positions is the fourth position, block 4.
    expect(place).toMatchObject({ position: 3, rail: null });
    expect(keptFeatureLabel(place!)).toBe('Block 4 keeps the breast pocket from the Green flannel shirt');
    expect(keptFeatureNote(place!)).toBe('keeps the breast pocket from the Green flannel shirt, centred, for block 4; cut with the feature centred');
    expect(keptFeatureNote({ feature: 'breast pocket', garment: 'Green flannel shirt' })).toBe('keeps the breast pocket from the Green flannel shirt, centred; cut with the feature centred');
  });

  it("puts the feature in the block given its own garment, when one is", () => {
    const body = top({ assignments: [{ target: { kind: 'position', index: 2 }, fabric: { kind: 'garment', garmentId: 7 } }] });
    const derived = deriveDesign(body);
    const places = keptFeaturePlaces(body, derived, keptFeaturePieces(planDesign(body, derived, shirt([pocket]))));
    // The square given the shirt itself is nearer than the planner's choice (plan-design.ts), and only block 3 uses it.
    expect(places.map((p) => p.position)).toEqual([2]);
  });

  it('finds the rail of a block of rails that holds a small feature', () => {
    // Three rails a block: 12 rails cut 8 1/2 x 3 1/4 in (2 2/3 in finished plus 1/2 in, rounded up to 1/8); the 2 x 1 in label fits inside one's seam allowances.
    const body = top({ blocks: [{ id: 'R', name: 'Rails', kind: 'rectangles', units: 3 }], pattern: ['R'] });
    const derived = deriveDesign(body);
    const summary = planDesign(body, derived, shirt([label]));
    expect(summary.keptFeatures!.map((k) => k.copy)).toEqual([12]);
    const [place] = keptFeaturePlaces(body, derived, keptFeaturePieces(summary));
    // Hand-worked: copy 12 of 12, three to a block, is the third rail of the fourth block.
    expect(place).toMatchObject({ position: 3, rail: 2 });
    expect(keptFeatureLabel(place!)).toBe("Block 4, rail 3, keeps the maker's label from the Green flannel shirt");
    // Its outline is that rail: the bottom third of the block at 8 in, 8 in.
    const mm = (n: number) => n * 25.4;
    const outline = keptFeatureOutline(body, derived, place!)!;
    expect(outline[0]![0]).toBeCloseTo(mm(8), 6);
    expect(outline[0]![1]).toBeCloseTo(mm(8 + 16 / 3), 6);
    expect(outline[2]![1]).toBeCloseTo(mm(16), 6);
    const block4 = designDrawing(body, derived).shapes.filter((s) => s.position === 3);
    expect(block4.some((s) => JSON.stringify(s.points) === JSON.stringify(outline))).toBe(true);
  });

  it('reads an older plan, stored without the list, from its placements and the garments', () => {
    const body = top();
    const derived = deriveDesign(body);
    const sources = shirt([pocket]);
    const { keptFeatures, ...older } = planDesign(body, derived, sources);
    expect(keptFeaturePieces(older, sources)).toEqual(keptFeatures);
    expect(keptFeaturePieces(older)).toEqual([]);
  });

  it('leaves out a feature whose piece the derivation no longer has', () => {
    const body = top();
    const derived = deriveDesign(body);
    const kept = keptFeaturePieces(planDesign(body, derived, shirt([pocket])));
    expect(keptFeaturePlaces(body, { ...derived, pieces: [] }, kept)).toEqual([]);
  });
});
