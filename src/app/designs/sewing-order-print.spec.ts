import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';

import { designScreen } from '../../testing/design-screen';
import { SewingOrderPrint } from './sewing-order-print';

describe('SewingOrderPrint', () => {
  let fixture: ComponentFixture<SewingOrderPrint>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [SewingOrderPrint], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    fixture = TestBed.createComponent(SewingOrderPrint);
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
    expect(sections[1]!.querySelector('.pressing')!.textContent).toContain('Press the blade seams all one way round');
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
