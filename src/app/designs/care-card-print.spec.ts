import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import { SAFE_SLEEP, SMALL_PARTS } from '@keepstitch/shared';

import { signedInAs } from '../../testing/signed-in-as';
import { Role } from '../core/user';
import { CareCard } from './design';
import { CareCardPrint } from './care-card-print';

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

describe('CareCardPrint', () => {
  let fixture: ComponentFixture<CareCardPrint>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  async function open(role: Role): Promise<void> {
    TestBed.configureTestingModule({ imports: [CareCardPrint], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs(role)] });
    fixture = TestBed.createComponent(CareCardPrint);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  afterEach(() => httpMock.verify());

  async function flush(body: object = card): Promise<void> {
    httpMock.expectOne('/api/commissions/5/care-card').flush(body);
    await fixture.whenStable();
  }

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
