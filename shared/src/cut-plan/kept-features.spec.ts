import { emptyNode } from './guillotine-packer';
import { placePinnedPieces, separate, skeletonTree } from './kept-features';
import { buildPlanModel } from './plan-model';

const fixed = (x: number, y: number, w: number, h: number) => ({ box: { x, y, w, h }, node: emptyNode(x, y, w, h) });

describe('kept features', () => {
  it('frames one fixed piece with edge-to-edge cuts, keeping the larger free part whole', () => {
    const tree = separate({ x: 0, y: 0, w: 20, h: 10 }, [fixed(2, 2, 4, 4)]);
    // A vertical cut first leaves the 14 x 10 right part whole (largest free part).
    expect(tree).toMatchObject({ kind: 'split', dir: 'v' });
    expect(tree?.kind === 'split' && tree.children[tree.children.length - 1]).toEqual(emptyNode(6, 0, 14, 10));
  });

  it('frames with horizontal or vertical cuts first when asked', () => {
    expect(separate({ x: 0, y: 0, w: 20, h: 10 }, [fixed(2, 2, 4, 4)], 'h')).toMatchObject({ kind: 'split', dir: 'h' });
    expect(separate({ x: 0, y: 0, w: 20, h: 10 }, [fixed(2, 2, 4, 4)], 'v')).toMatchObject({ kind: 'split', dir: 'v' });
  });

  it('cuts several fixed pieces apart when a full cut separates them, and refuses a pinwheel', () => {
    expect(separate({ x: 0, y: 0, w: 20, h: 20 }, [fixed(0, 0, 5, 5), fixed(10, 10, 5, 5)])).not.toBeNull();
    const pinwheel = [fixed(0, 0, 2, 1), fixed(2, 0, 1, 2), fixed(1, 2, 2, 1), fixed(0, 1, 1, 2)];
    expect(separate({ x: 0, y: 0, w: 3, h: 3 }, pinwheel)).toBeNull();
  });

  const model = (placement: 'centred' | { x: number; y: number }, size: number, more = false) =>
    buildPlanModel({
      panels: [{ garmentId: 'g', panelId: 'p', width: 20, height: 20, features: [{ id: 'pocket', x: 8, y: 4, width: 5, height: 6 }, { id: 'label', x: 9, y: 5, width: 1, height: 1 }] }],
      pieces: [
        { id: 'a', width: size, height: size, count: 1, keptFeature: { featureId: 'pocket', placement } },
        ...(more ? [{ id: 'b', width: 3, height: 3, count: 1, keptFeature: { featureId: 'label', placement: 'centred' as const } }] : []),
      ],
    });

  it('centres a piece on its feature, in steps', () => {
    const { placements, failures } = placePinnedPieces(model('centred', 8.5));
    expect(failures).toEqual([]);
    // derived: centre (10.5, 7) in, less half of 8.5 in: (6.25, 2.75) in.
    expect(placements[0]).toMatchObject({ x: 6250, y: 2750, w: 8500, h: 8500 });
    const tree = skeletonTree(model('centred', 8.5).bins[0], placements);
    expect(tree.kind).toBe('split');
  });

  it('fails a piece that would run off the panel, cannot hold its feature, or overlaps another kept piece', () => {
    expect(placePinnedPieces(model('centred', 16)).failures[0].detail).toMatch(/run off/);
    expect(placePinnedPieces(model({ x: 3, y: 0 }, 6)).failures[0].detail).toMatch(/does not fit inside the piece/);
    const both = placePinnedPieces(model('centred', 8.5, true));
    expect(both.placements).toHaveLength(1);
    expect(both.failures[0].detail).toMatch(/overlap/);
  });
});
