import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';

import { Notices } from '../core/notices';
import { CommissionDetail } from './commission';
import { DeliveryChecklist } from './delivery-checklist';

const commission: CommissionDetail = {
  id: 5,
  clientId: 4,
  title: 'Shirt quilt for Ada',
  kind: 'memory_quilt',
  ageGroup: 'adult',
  stage: 'ready',
  createdAt: '2026-10-01T09:00:00Z',
  cautions: [],
  garments: [
    { id: 31, description: 'Blue work shirt', status: 'used', returnsToClient: null },
    { id: 32, description: 'Floral dress', status: 'cut', returnsToClient: 'Collar, cuffs and the buttons' },
    { id: 33, description: 'School jumper', status: 'in_studio' },
    { id: 34, description: 'Wool scarf', status: 'expected' },
  ],
  progressPhotos: [],
  stageHistory: [],
  facts: { garmentCount: 3, garmentsReceived: 3 },
};

describe('DeliveryChecklist', () => {
  let fixture: ComponentFixture<DeliveryChecklist>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let element: HTMLElement;
  let changed: number;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DeliveryChecklist],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(DeliveryChecklist);
    fixture.componentRef.setInput('commission', commission);
    changed = 0;
    fixture.componentInstance.changed.subscribe(() => changed++);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const rows = () => Array.from(element.querySelectorAll('[data-testid="delivery-garment"]'));

  it('shows each garment with what returns to the client, and why delivery waits, naming the open garments', () => {
    expect(rows().map((r) => r.querySelector('[data-testid="delivery-returns"]')?.textContent?.trim())).toEqual([
      'Returns to the client: nothing asked for',
      'Returns to the client: Collar, cuffs and the buttons',
      'Returns to the client: nothing asked for',
      'Returns to the client: nothing asked for',
    ]);
    expect(rows()[0].querySelector('[data-testid="delivery-status"]')?.textContent).toBe('Used in the piece');
    expect(element.querySelector('[data-testid="delivery-progress"]')?.textContent).toBe('1 of 4 garments accounted for.');
    expect(element.querySelector('[data-testid="delivery-waiting"]')?.textContent).toBe(
      'Record what became of “Floral dress”, “School jumper” and “Wool scarf” first (used in the piece, returned whole or leftovers returned): their custody is still open.',
    );
    // An ended custody has no form; each open one has its own.
    expect(rows()[0].querySelector('ks-custody-ending-form')).toBeNull();
    expect(rows()[1].querySelector('ks-custody-ending-form')).not.toBeNull();
    expect(rows()[2].querySelector('ks-custody-ending-form')).not.toBeNull();
  });

  it('records the leftovers returned by post, asking for the tracking reference first', async () => {
    const within = await loader.getChildLoader('[data-garment="32"]');
    const what = (await (await within.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'What became of it' }))).getControl(MatSelectHarness))!;
    // The garment the client wants something back from starts at leftovers returned.
    expect(await what.getValueText()).toBe('Leftovers returned to the client');
    const how = (await (await within.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'How' }))).getControl(MatSelectHarness))!;
    await how.clickOptions({ text: 'By post' });
    const record = await within.getHarness(MatButtonHarness.with({ text: 'Record for “Floral dress”' }));
    await record.click();
    httpMock.expectNone('/api/garments/32/events');
    const tracking = await within.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Tracking reference' }));
    expect(await tracking.getTextErrors()).toEqual(['A posted return needs its tracking reference']);

    await (await tracking.getControl(MatInputHarness))!.setValue('KS-4471');
    await (await (await within.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Note' }))).getControl(MatInputHarness))!.setValue('Wrapped in tissue');
    await record.click();
    const request = httpMock.expectOne('/api/garments/32/events');
    expect(request.request.body).toEqual({ kind: 'leftovers_returned', returnMethod: 'post', trackingRef: 'KS-4471', note: 'Wrapped in tissue' });
    request.flush(
      { event: { id: 90, kind: 'leftovers_returned', at: '2026-12-04T10:00:00Z' }, state: { status: 'leftovers_returned', received: true, washed: false, place: null } },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    expect(changed).toBe(1);
  });

  it('records a garment used in the piece with no return details', async () => {
    const within = await loader.getChildLoader('[data-garment="33"]');
    expect(await within.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'How' }))).toEqual([]);
    await (await within.getHarness(MatButtonHarness.with({ text: 'Record for “School jumper”' }))).click();
    const request = httpMock.expectOne('/api/garments/33/events');
    expect(request.request.body).toEqual({ kind: 'used' });
    request.flush({ event: { id: 91, kind: 'used', at: '2026-12-04T10:00:00Z' }, state: { status: 'used', received: true, washed: false, place: null } });
  });

  it('offers only withdrawn for a garment that never came', async () => {
    const within = await loader.getChildLoader('[data-garment="34"]');
    const what = (await (await within.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'What became of it' }))).getControl(MatSelectHarness))!;
    expect(await what.getValueText()).toBe('Withdrawn (not coming)');
    await what.open();
    expect(await Promise.all((await what.getOptions()).map((o) => o.getText()))).toEqual(['Withdrawn (not coming)']);
    await what.close();
    await (await within.getHarness(MatButtonHarness.with({ text: 'Record for “Wool scarf”' }))).click();
    const request = httpMock.expectOne('/api/garments/34/events');
    expect(request.request.body).toEqual({ kind: 'withdrawn' });
    request.flush({ event: { id: 92, kind: 'withdrawn', at: '2026-12-04T10:00:00Z' }, state: { status: 'withdrawn', received: false, washed: false, place: null } });
  });

  it('says delivery can be recorded once every custody has ended', async () => {
    fixture.componentRef.setInput('commission', {
      ...commission,
      garments: commission.garments.map((g) => ({ ...g, status: g.id >= 33 ? 'withdrawn' : 'returned' })),
    });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="delivery-waiting"]')).toBeNull();
    expect(element.querySelector('[data-testid="delivery-ready"]')?.textContent).toContain('delivery can be recorded under Stage');
    expect(element.querySelectorAll('ks-custody-ending-form').length).toBe(0);
  });
});
