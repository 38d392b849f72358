import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { DesignBody, DesignSources, deriveDesign, planDesign } from '@keepstitch/shared';

import { designScreen, plateDesign, threeShirts, version } from '../../testing/design-screen';
import { CutListPrint } from './cut-list-print';
import { GarmentSource, groupFabric } from './design';

const inch = (n: number) => String((n * 254) / 10);

describe('CutListPrint', () => {
  let fixture: ComponentFixture<CutListPrint>;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  // Two rows of two 8 in squares: block 1 from "The blues" (blue and navy), the rest the planner's choice.
  // The green flannel's left front carries a breast pocket, which only a planner's-choice square may hold.
  const body: DesignBody = {
    ...plateDesign({ layout: { setting: 'straight', rows: 2, columns: 2, blockMm: inch(8), sashing: null, borders: [] } }),
    blocks: [{ id: 'A', name: 'Plain square', kind: 'square' }],
    pattern: ['A'],
    groups: [{ id: 'g1', name: 'The blues', garmentIds: [8, 9] }],
    assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'group', groupId: 'g1' } }],
  };
  const pocket = { name: 'breast pocket', xMm: inch(2), yMm: inch(4), widthMm: inch(5), heightMm: inch(5.5) };
  const shirts = threeShirts();
  const garments: GarmentSource[] = shirts.garments.map((g) => (g.id === 10 ? { ...g, panels: [{ id: 102, name: 'left front', widthMm: inch(12), heightMm: inch(24), grain: 'vertical', features: [pocket] }] } : g));
  const sources: DesignSources = {
    garments: garments.map((g) => ({ ...g, panels: g.panels.map((p) => ({ ...p, grain: 'vertical' as const, features: p.features ?? [] })) })),
    stock: [],
  };
  const plan = planDesign(body, deriveDesign(body), sources);

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [CutListPrint], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    fixture = TestBed.createComponent(CutListPrint);
    fixture.componentRef.setInput('id', '5');
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    const fabrics = [...shirts.fabrics, groupFabric(body.groups![0]!, shirts.fabrics)];
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(version(3, body, { plan }), [], { garments, fabrics }));
    await fixture.whenStable();
  });

  afterEach(() => httpMock.verify());

  const text = (e: Element) => e.textContent!.replace(/\s+/g, ' ').trim();

  it('notes under its line that one square keeps the pocket, for which block, and how to cut it', () => {
    const green = [...page.querySelectorAll('[data-testid="cut-source"]')].find((s) => s.querySelector('h2')!.textContent!.startsWith('From the Green checked flannel shirt'))!;
    const notes = [...green.querySelectorAll('[data-testid="kept-note"]')].map(text);
    // The plan keeps the pocket in the last planner's-choice square, copy 3 of 3: block 4.
    expect(notes).toEqual(['Kept feature: 1 of these keeps the breast pocket from the Green checked flannel shirt, centred, for block 4; cut with the feature centred.']);
    // Nowhere else.
    expect(page.querySelectorAll('[data-testid="kept-note"]').length).toBe(1);
  });

  it('marks the kept piece in its panel diagram, with the pocket where it lies, and names it in the cut that frees it', () => {
    const marked = [...page.querySelectorAll('[data-testid="kept-piece"]')];
    expect(marked.length).toBe(1);
    expect(marked[0]!.querySelector('title')!.textContent).toMatch(/^Piece \d+ keeps the breast pocket$/);
    // The pocket outline, 5 x 5 1/2 in at 2 in, 4 in on the panel, in the panel's millimetres.
    const rects = [...marked[0]!.querySelectorAll('rect')];
    const feature = rects[rects.length - 1]!;
    expect(Number(feature.getAttribute('x'))).toBeCloseTo(50.8, 6);
    expect(Number(feature.getAttribute('y'))).toBeCloseTo(101.6, 6);
    expect(Number(feature.getAttribute('width'))).toBeCloseTo(127, 6);
    expect(Number(feature.getAttribute('height'))).toBeCloseTo(139.7, 6);
    // Black dashes, so the mark reads on a black-and-white printer.
    expect(rects.some((r) => r.getAttribute('stroke') === '#000' && r.hasAttribute('stroke-dasharray'))).toBeTrue();
    const steps = [...page.querySelectorAll('.kept-step')].map(text);
    expect(steps.length).toBe(1);
    expect(steps[0]).toContain('which keeps the breast pocket from the Green checked flannel shirt, centred, for block 4; cut with the feature centred');
  });

  it('draws the top with the kept block marked, and keys the group as stripes of its garments', () => {
    const top = page.querySelector('[data-testid="cut-list-top"]')!;
    expect(top.querySelector('[data-testid="kept-mark"]')!.getAttribute('aria-label')).toBe('Block 4 keeps the breast pocket from the Green checked flannel shirt');
    const key = [...top.querySelectorAll('.fabric-key li')];
    expect(key.map(text)).toEqual(['The blues (a group: stripes of its garments)', 'Planner chooses (any garment)']);
    const swatch = key[0]!.querySelector<HTMLElement>('.swatch')!.style.background;
    // Blue (157, 183, 213) and navy (38, 53, 93), not the first garment's colour alone.
    expect(swatch).toContain('repeating-linear-gradient');
    expect(swatch).toContain('rgb(157, 183, 213)');
    expect(swatch).toContain('rgb(38, 53, 93)');
  });
});
