import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import { DesignBody, DesignSources, PrintoutSources, SAFE_SLEEP, SMALL_PARTS, buildPrintout, contentWords, deriveDesign, planDesign, printoutOf } from '@keepstitch/shared';

import { designScreen, plateDesign, threeShirts, version } from '../../testing/design-screen';
import { signedInAs } from '../../testing/signed-in-as';
import { Role } from '../core/user';
import { CareCard, GarmentSource, groupFabric } from './design';
import { PrintoutPage } from './printout-page';

// One page draws every printout from its content model; each printout's page is checked here as it prints.

/** Words as compared: spacing aside. */
const flat = (s: string) => s.replace(/\s+/g, ' ').trim();

/** Every word the content model gives the page for this printout and data, missing from the page. */
function missingWords(page: HTMLElement, id: string, data: PrintoutSources[keyof PrintoutSources]): string[] {
  const shown = flat(page.textContent!);
  const d = new Date();
  const printedOn = `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
  return contentWords(buildPrintout(printoutOf(id)!, data as never, { printedOn }), 'page').map(flat).filter((w) => !shown.includes(w));
}

const inch = (n: number) => String((n * 254) / 10);

describe('PrintoutPage: cut-list', () => {
  let fixture: ComponentFixture<PrintoutPage>;
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
    TestBed.configureTestingModule({ imports: [PrintoutPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs('owner')] });
    fixture = TestBed.createComponent(PrintoutPage);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('printout', 'cut-list');
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    const fabrics = [...shirts.fabrics, groupFabric(body.groups![0]!, shirts.fabrics)];
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(version(3, body, { plan }), [], { garments, fabrics }));
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

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

  it('shows every word of the cut list its content model holds', () => {
    const fabrics = [...shirts.fabrics, groupFabric(body.groups![0]!, shirts.fabrics)];
    expect(missingWords(page, 'cut-list', { commission: { id: 5, title: 'Work-shirt memory quilt' }, version: version(3, body, { plan }), garments, stock: [], fabrics })).toEqual([]);
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

describe('PrintoutPage: sewing-order', () => {
  let fixture: ComponentFixture<PrintoutPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [PrintoutPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs('owner')] });
    fixture = TestBed.createComponent(PrintoutPage);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('printout', 'sewing-order');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  async function flush(body: object): Promise<void> {
    httpMock.expectOne('/api/commissions/5/design').flush(body);
    await fixture.whenStable();
  }

  it('lists each block kind, then the top, with the count of every step and a pressing note', async () => {
    await flush(designScreen());
    const sections = [...page.querySelectorAll('[data-testid="sewing-section"]')];
    expect(sections.map((s) => s.querySelector('h2')!.textContent!.trim())).toEqual([
      'Block A, Plain square: 2 blocks',
      'Block B, Dresden plate: 2 blocks',
      'The top',
    ]);
    // Hand-worked: 20 blades make 10 pairs, then 5 sets of four, then one ring per block (2 plates).
    const plate = [...sections[1]!.querySelectorAll('[data-testid="sewing-step"]')].map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
    expect(plate[0]).toBe('Sew the blades into 10 pairs [10]');
    expect(plate[1]).toBe('Join the pairs into 5 sets of four [5]');
    expect(plate[2]).toBe('Join the sets into one ring [2]');
    expect(sections[1]!.querySelector('[data-testid="pressing"]')!.textContent).toContain('Press the blade seams all one way round');
    // A step without a count shows none: layering is done once.
    const top = [...sections[2]!.querySelectorAll('[data-testid="sewing-step"]')].map((li) => li.textContent!.trim());
    expect(top).toContain('Layer backing (right side down), wadding and top; baste and quilt');
    expect(page.querySelector('[data-testid="sewing-order-meta"]')!.textContent).toContain('Work-shirt memory quilt, design version 1, printed');
  });

  it('prints from the browser and links the PDF', async () => {
    await flush(designScreen());
    const print = spyOn(window, 'print');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Print/ }))).click();
    expect(print).toHaveBeenCalledTimes(1);
    const pdf = await (await loader.getHarness(MatButtonHarness.with({ text: 'PDF' }))).host();
    expect(await pdf.getAttribute('href')).toBe('/api/commissions/5/design/sewing-order.pdf');
    // The buttons stay off the paper.
    expect(page.querySelector('ks-print-bar')!.classList).toContain('ks-no-print');
  });

  it('says when there is no saved design', async () => {
    await flush(designScreen(null));
    expect(page.textContent).toContain('This commission has no saved design yet.');
    expect(page.querySelector('[data-testid="sewing-section"]')).toBeNull();
  });

  it('says when the sewing order cannot be loaded', async () => {
    httpMock.expectOne('/api/commissions/5/design').flush({ error: { code: 'not-found', message: 'Not found' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('The sewing order could not be loaded.');
  });
});

/** CSS fixes 1 in at 96 px, so a length in mm is this many CSS pixels on screen. */
const PX_PER_MM = 96 / 25.4;

/** Width and height of a polygon's points, in its own (mm) units. */
function extent(points: string): { width: number; height: number } {
  const xy = points.split(' ').map((p) => p.split(',').map(Number) as [number, number]);
  const xs = xy.map((p) => p[0]);
  const ys = xy.map((p) => p[1]);
  return { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

describe('PrintoutPage: templates', () => {
  let fixture: ComponentFixture<PrintoutPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [PrintoutPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs('owner')] });
    fixture = TestBed.createComponent(PrintoutPage);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('printout', 'templates');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  async function flush(body: object): Promise<void> {
    httpMock.expectOne('/api/commissions/5/design').flush(body);
    await fixture.whenStable();
  }

  const templates = () => [...page.querySelectorAll<HTMLElement>('[data-testid="template"]')];

  it('draws each template in millimetres: the SVG is sized in mm and its view box counts mm, so it shows at 1:1', async () => {
    await flush(designScreen());
    expect(templates().map((t) => t.querySelector('h2')!.textContent!.trim())).toEqual(['Block B blade (20 of 360 degrees)', 'Block B centre circle']);
    for (const t of templates()) {
      const svg = t.querySelector<SVGSVGElement>('svg.outline')!;
      const [, , vbW, vbH] = svg.getAttribute('viewBox')!.split(' ').map(Number);
      expect(svg.getAttribute('width')).toBe(`${vbW}mm`);
      expect(svg.getAttribute('height')).toBe(`${vbH}mm`);
      const box = svg.getBoundingClientRect();
      expect(box.width).toBeCloseTo(vbW! * PX_PER_MM, 1);
      expect(box.height).toBeCloseTo(vbH! * PX_PER_MM, 1);
    }
  });

  it('draws the blade cut line at its cut size, with the sewing line inside it as a second, dashed line', async () => {
    await flush(designScreen());
    const blade = templates()[0]!;
    const cut = extent(blade.querySelector('polygon.cut')!.getAttribute('points')!);
    const sewing = extent(blade.querySelector('polygon.inner')!.getAttribute('points')!);
    // Derived: 20 blades, half-angle h = 9 degrees, R = 4 1/2 in = 114.3 mm, s = 1/4 in = 6.35 mm;
    // cut top = 2R sin h + 2s tan h + 2s / cos h.
    const h = (9 * Math.PI) / 180;
    expect(cut.width).toBeCloseTo(2 * 114.3 * Math.sin(h) + 2 * 6.35 * Math.tan(h) + (2 * 6.35) / Math.cos(h), 3);
    // Finished top = 2R sin h; the sewing line is dashed, the cut line solid.
    expect(sewing.width).toBeCloseTo(2 * 114.3 * Math.sin(h), 3);
    expect(blade.querySelector('polygon.inner')!.getAttribute('stroke-dasharray')).toBeTruthy();
    expect(blade.querySelector('polygon.cut')!.getAttribute('stroke-dasharray')).toBeNull();
    // Grain arrow along the blade, with its word, and the sizes in both unit systems.
    const grain = blade.querySelector('g.grain line')!;
    expect(grain.getAttribute('x1')).toBe(grain.getAttribute('x2'));
    expect(blade.textContent).toContain('grain');
    // Cut sizes round up to the ruler step (1/8 in, 1 mm), as in the PDF: 76.2 mm reads 77 mm.
    expect(blade.textContent).toContain('strip width 3 in (77 mm)');
  });

  it('draws the centre circle: fabric 5 in across, card 4 1/2 in', async () => {
    await flush(designScreen());
    const circle = templates()[1]!;
    // Derived: card radius = inner radius 2 in + 1/4 in overlap; fabric = card + 1/4 in turn allowance.
    expect(extent(circle.querySelector('polygon.cut')!.getAttribute('points')!).width).toBeCloseTo(127, 3);
    expect(extent(circle.querySelector('polygon.inner')!.getAttribute('points')!).width).toBeCloseTo(114.3, 3);
    expect(circle.textContent).toContain('card template (finished edge)');
  });

  it('shows a 1 in and a 2.5 cm check square at their real sizes, and says to print at 100% or use the PDF', async () => {
    await flush(designScreen());
    expect(page.querySelector('[data-testid="check-inch"]')!.getBoundingClientRect().width).toBeCloseTo(96, 1);
    expect(page.querySelector('[data-testid="check-cm"]')!.getBoundingClientRect().width).toBeCloseTo(25 * PX_PER_MM, 1);
    const note = page.querySelector('[data-testid="scale-note"]')!.textContent!;
    expect(note).toContain('The PDF is the exact-scale version');
    expect(note).toContain('100%');
    expect(note).toContain('actual size');
  });

  it('flags a template larger than one sheet and sends it to the tiled PDF', async () => {
    // A 24 in block with a plate of 10 1/2 in radius: blades about 9 7/8 in tall, more than a sheet leaves.
    const big = plateDesign({ layout: { setting: 'straight', rows: 1, columns: 2, blockMm: '609.6', sashing: null, borders: [] } });
    big.blocks[1] = { ...big.blocks[1]!, outerRadiusMm: '266.7', innerRadiusMm: '25.4' };
    big.pattern = ['A', 'B'];
    await flush(designScreen(version(2, big)));
    const [blade, circle] = templates();
    expect(blade!.querySelector('.warn')!.textContent).toContain('print this template from the PDF');
    expect(circle!.querySelector('.warn')).toBeNull();
  });

  it('links both PDFs and prints from the browser', async () => {
    await flush(designScreen());
    const href = async (text: string) => (await (await loader.getHarness(MatButtonHarness.with({ text }))).host()).getAttribute('href');
    expect(await href('PDF, A4')).toBe('/api/commissions/5/design/templates.pdf?paper=a4');
    expect(await href('PDF, US Letter')).toBe('/api/commissions/5/design/templates.pdf?paper=letter');
    const print = spyOn(window, 'print');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Print/ }))).click();
    expect(print).toHaveBeenCalled();
  });

  it('says a design without curved pieces needs no templates', async () => {
    const squares = plateDesign({ blocks: [{ id: 'A', name: 'Plain square', kind: 'square' }], pattern: ['A'] });
    await flush(designScreen(version(1, squares)));
    expect(templates().length).toBe(0);
    expect(page.querySelector('[data-testid="no-templates"]')!.textContent).toContain('needs no templates');
  });
});

const card: CareCard = {
  commission: { id: 5, title: 'Baby blanket from Dad’s shirts', kind: 'baby_quilt', ageGroup: 'baby_under_1' },
  maker: 'Ottilie Marsh',
  washing: ['Wash cool (30 °C at most) on a gentle cycle, with a mild detergent and no bleach.', 'Add a colour-catcher sheet to each wash: the piece mixes fabrics from different garments.'],
  fibres: [
    { fibre: 'cotton', garments: ['Blue oxford work shirt', 'Check flannel shirt'], studio: ['Navy binding cotton'] },
    { fibre: 'unknown', garments: ['Old band T-shirt'], studio: [] },
    { fibre: 'blend', garments: [], studio: ['Cotton wadding 80/20'] },
  ],
  cautions: [SAFE_SLEEP, SMALL_PARTS],
  deferNote: 'These notes are guidance. Where local guidance, a health visitor or a doctor advises differently, follow their advice.',
};

describe('PrintoutPage: care-card', () => {
  let fixture: ComponentFixture<PrintoutPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  async function open(role: Role): Promise<void> {
    TestBed.configureTestingModule({ imports: [PrintoutPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs(role)] });
    fixture = TestBed.createComponent(PrintoutPage);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('printout', 'care-card');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  async function flush(body: object = card): Promise<void> {
    httpMock.expectOne('/api/commissions/5/care-card').flush(body);
    await fixture.whenStable();
  }

  it('shows every word of the care card its content model holds', async () => {
    await open('owner');
    await flush();
    expect(missingWords(page, 'care-card', card)).toEqual([]);
  });

  it('gives the client washing, what went in by fibre, the maker and the safety notices, deferring to local guidance', async () => {
    await open('client');
    await flush();
    expect(page.querySelector('h1')!.textContent).toBe('Caring for your baby quilt');
    expect(page.querySelector('[data-testid="care-card-meta"]')!.textContent).toContain('Made by Ottilie Marsh');
    expect(page.querySelectorAll('[data-testid="washing"] li').length).toBe(2);
    expect(page.querySelector('[data-testid="washing"]')!.textContent).toContain('colour-catcher');
    const fibres = [...page.querySelectorAll('[data-testid="fibres"] li')].map((li) => li.textContent!.trim());
    expect(fibres).toEqual([
      'Cotton: Blue oxford work shirt, Check flannel shirt; Navy binding cotton (studio fabric)',
      'Fibre not known: Old band T-shirt',
      'Blend: Cotton wadding 80/20 (studio fabric)',
    ]);
    const cautions = [...page.querySelectorAll('[data-testid="caution"]')];
    expect(cautions.map((c) => c.querySelector('h3')!.textContent)).toEqual([SAFE_SLEEP.title, SMALL_PARTS.title]);
    expect(cautions[0]!.textContent).toContain(SAFE_SLEEP.source);
    expect(page.querySelector('[data-testid="defer-note"]')!.textContent).toContain('follow their advice');
  });

  it('takes the client back to their commission in the portal, and the studio back to the design', async () => {
    await open('client');
    await flush();
    expect(page.querySelector('[data-testid="print-back"]')!.getAttribute('href')).toBe('/portal/5');
    TestBed.resetTestingModule();
    await open('workroom');
    await flush();
    expect(page.querySelector('[data-testid="print-back"]')!.getAttribute('href')).toBe('/designs/5');
  });

  it('shows no safety section when no notice applies', async () => {
    await open('owner');
    await flush({ ...card, commission: { ...card.commission, kind: 'memory_quilt', ageGroup: 'adult' }, cautions: [] });
    expect(page.querySelector('h1')!.textContent).toBe('Caring for your memory quilt');
    expect(page.querySelector('[data-testid="caution"]')).toBeNull();
    expect(page.textContent).not.toContain('Safety');
  });

  it('prints from the browser and links the PDF', async () => {
    await open('client');
    await flush();
    const print = spyOn(window, 'print');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Print/ }))).click();
    expect(print).toHaveBeenCalled();
    expect(await (await (await loader.getHarness(MatButtonHarness.with({ text: 'PDF' }))).host()).getAttribute('href')).toBe('/api/commissions/5/care-card.pdf');
  });

  it('shows progress while loading, says when the care card cannot be loaded, and tries again on request', async () => {
    await open('client');
    const printButton = () => [...page.querySelectorAll('button')].find((b) => b.textContent!.includes('Print'))!;
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    expect(printButton().disabled).toBeTrue();
    httpMock.expectOne('/api/commissions/5/care-card').flush({ error: { code: 'not-found', message: 'That commission was not found.' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('The care card could not be loaded.');
    expect(page.querySelector('mat-progress-bar')).toBeNull();

    [...page.querySelectorAll<HTMLButtonElement>('[role="alert"] button')].find((b) => b.textContent!.includes('Try again'))!.click();
    fixture.detectChanges();
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    await flush();
    expect(page.querySelector('[role="alert"]')).toBeNull();
    expect(page.querySelector('h1')!.textContent).toContain('Caring for your');
    expect(printButton().disabled).toBeFalse();
  });
});
