import { ComponentFixture, TestBed } from '@angular/core/testing';
import { DesignBody, KeptFeaturePlace, deriveDesign } from '@keepstitch/shared';

import { QuiltDrawing } from './quilt-drawing';

const inch = (n: number) => String(n * 254 / 10);

function design(over: Partial<DesignBody['layout']> = {}): DesignBody {
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(40), lengthMm: inch(40) },
    layout: { setting: 'straight', rows: 2, columns: 3, blockMm: inch(10), sashing: { widthMm: inch(2), cornerstones: true }, borders: [inch(3)], ...over },
    blocks: [
      { id: 'A', name: 'Square', kind: 'square' },
      { id: 'B', name: 'Triangles', kind: 'hst', units: 1 },
    ],
    pattern: ['A', 'B'],
    assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: 4 } }],
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
    rules: { minimumPerGarment: 0 },
  };
}

describe('QuiltDrawing', () => {
  let fixture: ComponentFixture<QuiltDrawing>;

  async function draw(body: DesignBody, colours: Record<string, string> = {}, kept: KeptFeaturePlace[] = []): Promise<SVGSVGElement> {
    TestBed.configureTestingModule({ imports: [QuiltDrawing] });
    fixture = TestBed.createComponent(QuiltDrawing);
    fixture.componentRef.setInput('body', body);
    fixture.componentRef.setInput('derived', deriveDesign(body));
    fixture.componentRef.setInput('colours', colours);
    fixture.componentRef.setInput('kept', kept);
    await fixture.whenStable();
    return (fixture.nativeElement as HTMLElement).querySelector('svg')!;
  }

  it('draws the top to scale in millimetres: 3 x 10 + 2 x 2 + 2 x 3 in wide, 2 x 10 + 2 + 6 in long', async () => {
    // Hand-worked: 40 in = 1016 mm across, 28 in = 711.2 mm down.
    const svg = await draw(design());
    const [, , w, h] = svg.getAttribute('viewBox')!.split(' ').map(Number);
    expect(w).toBeCloseTo(1016, 6);
    expect(h).toBeCloseTo(711.2, 6);
  });

  it('colours a block by the garment assigned to its position, and hatches the planner’s choice', async () => {
    const svg = await draw(design(), { 'garment:4': '#123456' });
    const first = svg.querySelector('polygon[data-position="0"]')!;
    expect(first.getAttribute('fill')).toBe('#123456');
    const second = svg.querySelectorAll('polygon[data-position="1"]');
    // Hand-worked: a one-unit HST block is two triangles.
    expect(second.length).toBe(2);
    expect(second[0]!.getAttribute('fill')).toBe('url(#ks-any-fabric)');
  });

  it('draws the cornerstones, the sashing and the border', async () => {
    const svg = await draw(design());
    const parts = [...svg.querySelectorAll('polygon title')].map((t) => t.textContent);
    // Hand-worked: 1 row line x 2 column lines = 2 cornerstones.
    expect(parts.filter((p) => p === 'cornerstone').length).toBe(2);
    expect(parts).toContain('sashing');
    expect(parts).toContain('border 1');
  });

  it('turns blocks on point by 45 degrees', async () => {
    const svg = await draw({ ...design({ setting: 'on-point', rows: 2, columns: 2, sashing: null, borders: [] }), pattern: ['A'] });
    // Hand-worked: 2 x 2 on point holds 4 + 1 = 5 blocks.
    expect(svg.querySelectorAll('polygon[data-position]').length).toBe(5);
    const pts = svg.querySelector('polygon[data-position="0"]')!.getAttribute('points')!.split(' ').map((p) => p.split(',').map(Number));
    // A turned square's first corner sits straight above... its corners differ in both x and y from their neighbours.
    expect(Math.abs(pts[0]![0]! - pts[1]![0]!)).toBeGreaterThan(1);
    expect(Math.abs(pts[0]![1]! - pts[1]![1]!)).toBeGreaterThan(1);
  });

  it("fills a group's places with stripes of its garments' colours, in the group's order, from the design's list of groups", async () => {
    const body = { ...design(), groups: [{ id: 'g1', name: 'The blues', garmentIds: [9, 4] }], assignments: [{ target: { kind: 'position' as const, index: 0 }, fabric: { kind: 'group' as const, groupId: 'g1' } }] };
    const svg = await draw(body, { 'garment:4': '#123456', 'garment:9': '#abcdef' });
    const pattern = svg.querySelector('pattern[data-group="group:g1"]')!;
    expect([...pattern.querySelectorAll('rect')].map((r) => r.getAttribute('fill'))).toEqual(['#abcdef', '#123456']);
    expect(svg.querySelector('polygon[data-position="0"]')!.getAttribute('fill')).toBe(`url(#${pattern.id})`);
  });

  it('marks the block holding a kept feature with an outline, names it, and keys it below', async () => {
    const svg = await draw(design(), {}, [{ position: 2, rail: null, feature: 'breast pocket', garment: 'Green flannel shirt' }]);
    const marks = svg.querySelectorAll('[data-testid="kept-mark"]');
    expect(marks.length).toBe(1);
    expect(marks[0]!.getAttribute('aria-label')).toBe('Block 3 keeps the breast pocket from the Green flannel shirt');
    expect(marks[0]!.querySelector('title')!.textContent).toBe('Block 3 keeps the breast pocket from the Green flannel shirt');
    // The outline is block 3's square: its corners are those of the block's own polygon.
    const dashed = marks[0]!.querySelector('polygon[stroke-dasharray]')!;
    expect(dashed.getAttribute('points')).toBe(svg.querySelector('polygon[data-position="2"]')!.getAttribute('points'));
    expect(dashed.getAttribute('stroke')).toBe('#000');
    expect(svg.getAttribute('aria-label')).toBe('Drawing of the quilt top, 6 blocks; Block 3 keeps the breast pocket from the Green flannel shirt');
    const key = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="kept-legend"]')!;
    expect(key.textContent).toContain('Dashed outline and dot: a block piece cut around a feature kept whole');
    expect(key.textContent).toContain('Block 3 keeps the breast pocket from the Green flannel shirt.');
  });

  it('shows no key when nothing is kept', async () => {
    await draw(design());
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="kept-legend"]')).toBeNull();
  });
});
