import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';

import { designScreen, plateDesign, version } from '../../testing/design-screen';
import { TemplatesPrint } from './templates-print';

/** CSS fixes 1 in at 96 px, so a length in mm is this many CSS pixels on screen. */
const PX_PER_MM = 96 / 25.4;

/** Width and height of a polygon's points, in its own (mm) units. */
function extent(points: string): { width: number; height: number } {
  const xy = points.split(' ').map((p) => p.split(',').map(Number) as [number, number]);
  const xs = xy.map((p) => p[0]);
  const ys = xy.map((p) => p[1]);
  return { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

describe('TemplatesPrint', () => {
  let fixture: ComponentFixture<TemplatesPrint>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [TemplatesPrint], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    fixture = TestBed.createComponent(TemplatesPrint);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => httpMock.verify());

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
