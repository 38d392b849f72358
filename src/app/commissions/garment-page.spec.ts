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

import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { GarmentDetail } from './commission';
import { GarmentPage } from './garment-page';

const garment: GarmentDetail = {
  id: 21,
  commissionId: 3,
  description: 'Blue oxford work shirt',
  whose: 'Edmund',
  story: null,
  fibre: 'cotton',
  construction: 'woven',
  colour: 'Pale blue',
  print: 'plain',
  features: [],
  status: 'in_studio',
  received: true,
  washed: false,
  place: 'Box 3',
  removeForSafety: [],
  panels: [],
  photos: [],
  events: [
    { id: 1, kind: 'announced', at: '2026-11-01T09:00:00Z', note: null },
    { id: 2, kind: 'received', at: '2026-11-02T09:00:00Z', note: 'Arrived by post' },
    { id: 3, kind: 'stored', at: '2026-11-02T10:00:00Z', place: 'Box 3' },
  ],
};

describe('GarmentPage custody', () => {
  let fixture: ComponentFixture<GarmentPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [GarmentPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('workroom'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(GarmentPage);
    fixture.componentRef.setInput('id', '3');
    fixture.componentRef.setInput('garmentId', '21');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    httpMock.expectOne('/api/garments/21').flush(garment);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  async function chooseEvent(label: string): Promise<void> {
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Event' }));
    await (await field.getControl(MatSelectHarness))!.clickOptions({ text: label });
    await fixture.whenStable();
  }
  async function type(label: string, text: string): Promise<void> {
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    await (await field.getControl(MatInputHarness))!.setValue(text);
  }
  const record = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Record event' }))).click();

  it('lists the log newest first, numbered down from the latest', () => {
    expect((fixture.nativeElement as HTMLElement).querySelector<HTMLOListElement>('[data-testid="custody-log"]')!.reversed).toBeTrue();
    const entries = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="custody-event"]'));
    expect(entries.map((e) => e.textContent)).toEqual([
      jasmine.stringContaining('Stored at Box 3'),
      jasmine.stringContaining('Received — Arrived by post'),
      jasmine.stringContaining('Announced by the client'),
    ]);
  });

  it('offers the usual next entry first: a garment stored in Box 3 is next moved, not received again', async () => {
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Event' }));
    expect(await (await field.getControl(MatSelectHarness))!.getValueText()).toBe('Moved');
  });

  it('asks for the tracking reference of a posted return before sending it', async () => {
    await chooseEvent('Returned whole to the client');
    const how = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'How' }));
    await (await how.getControl(MatSelectHarness))!.clickOptions({ text: 'By post' });
    await fixture.whenStable();
    await record();
    httpMock.expectNone('/api/garments/21/events');
    const tracking = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Tracking reference' }));
    expect(await tracking.getTextErrors()).toEqual(['A posted return needs its tracking reference']);

    await type('Tracking reference', 'KS 1234 5678');
    await record();
    const request = httpMock.expectOne('/api/garments/21/events');
    expect(request.request.body).toEqual({ kind: 'returned', returnMethod: 'post', trackingRef: 'KS 1234 5678' });
    request.flush(
      { event: { id: 4, kind: 'returned', at: '2026-11-05T09:00:00Z' }, state: { status: 'returned', received: true, washed: false, place: null } },
      { status: 201, statusText: 'Created' },
    );
    httpMock.expectOne('/api/garments/21').flush({ ...garment, status: 'returned', place: null });
  });

  it('records the leftovers returned in person, with the return fields a whole return has', async () => {
    await chooseEvent('Leftovers returned to the client');
    expect(await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'How' }))).not.toEqual([]);
    await type('Note', 'Collar and cuffs, handed over at the studio');
    await record();
    const request = httpMock.expectOne('/api/garments/21/events');
    expect(request.request.body).toEqual({ kind: 'leftovers_returned', returnMethod: 'in_person', note: 'Collar and cuffs, handed over at the studio' });
    request.flush(
      { event: { id: 5, kind: 'leftovers_returned', at: '2026-11-05T09:00:00Z' }, state: { status: 'leftovers_returned', received: true, washed: false, place: null } },
      { status: 201, statusText: 'Created' },
    );
    httpMock.expectOne('/api/garments/21').flush({ ...garment, status: 'leftovers_returned', place: null });
  });

  it('takes a place as long as the server keeps, and marks a longer one without sending it', async () => {
    await chooseEvent('Stored');
    await type('Place', 'S'.repeat(61));
    await record();
    httpMock.expectNone('/api/garments/21/events');
    const place = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Place' }));
    expect(await place.getTextErrors()).toEqual(['At most 60 characters']);

    await type('Place', 'Shelf B2, the long cedar box under the window'.padEnd(60, '.'));
    await record();
    const request = httpMock.expectOne('/api/garments/21/events');
    expect(request.request.body.place.length).toBe(60);
    request.flush(
      { event: { id: 4, kind: 'stored', at: '2026-11-05T09:00:00Z' }, state: { status: 'in_studio', received: true, washed: false, place: 'Shelf B2' } },
      { status: 201, statusText: 'Created' },
    );
    httpMock.expectOne('/api/garments/21').flush(garment);
  });

  it('corrects a listed entry with a note, and shows a refusal from the server', async () => {
    await chooseEvent('Correction');
    const entry = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Entry to correct' }));
    const options = await (await entry.getControl(MatSelectHarness))!;
    await options.open();
    const texts = await Promise.all((await options.getOptions()).map((o) => o.getText()));
    expect(texts.length).toBe(2);
    expect(texts[0]).toContain('Received');
    await options.clickOptions({ text: /Stored at Box 3/ });
    await type('Note', 'It went on shelf B, not box 3');
    await record();
    const request = httpMock.expectOne('/api/garments/21/events');
    expect(request.request.body).toEqual({ kind: 'correction', correctsEventId: 3, note: 'It went on shelf B, not box 3' });
    request.flush(
      { error: { code: 'custody_refused', message: 'That entry has already been corrected.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('.event-form [role="alert"]')?.textContent).toContain(
      'That entry has already been corrected.',
    );
  });

  it('edits the details in place and shows the saved garment afterwards', async () => {
    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelector('[data-testid="garment-fibre"]')?.textContent).toContain('Cotton');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Edit details/ }))).click();
    await fixture.whenStable();
    const fibre = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Fibre' }));
    await (await fibre.getControl(MatSelectHarness))!.clickOptions({ text: 'Linen' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save details' }))).click();
    const request = httpMock.expectOne('/api/garments/21');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ fibre: 'linen' });
    const { events: _events, status: _status, place: _place, ...ownFields } = garment;
    request.flush({ ...ownFields, fibre: 'linen' });
    await fixture.whenStable();
    expect(page.querySelector('ks-garment-details-form')).toBeNull();
    expect(page.querySelector('[data-testid="garment-fibre"]')?.textContent).toContain('Linen');
    // The place stays shown while the full garment loads again.
    expect(page.querySelector('[data-testid="garment-place"]')?.textContent).toContain('Box 3');
    const reload = httpMock.expectOne('/api/garments/21');
    expect(reload.request.method).toBe('GET');
    reload.flush({ ...garment, fibre: 'linen' });
  });
});
