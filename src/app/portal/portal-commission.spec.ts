import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { CommissionDetail } from '../commissions/commission';
import { Notices } from '../core/notices';
import { PortalCommission } from './portal-commission';

const detail: CommissionDetail = {
  id: 5,
  clientId: 11,
  client: { id: 11, name: 'Cass Penrose' },
  title: 'Work-shirt memory quilt',
  kind: 'memory_quilt',
  recipient: null,
  ageGroup: 'adult',
  occasion: null,
  sizePreset: null,
  widthMm: null,
  lengthMm: null,
  deadline: '2027-01-16',
  daysLeft: 45,
  overdue: false,
  stage: 'preparation',
  createdAt: '2026-10-01T09:00:00Z',
  cautions: [],
  garments: [{ id: 8, description: 'Blue oxford work shirt', status: 'in_studio', photos: [] }],
  progressPhotos: [],
  stageHistory: [],
  facts: { garmentCount: 1, garmentsReceived: 1 },
};

describe('PortalCommission', () => {
  let fixture: ComponentFixture<PortalCommission>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;
  let shownBeforeQuote: { hidden: boolean; bar: string | null };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [PortalCommission],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('client'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(PortalCommission);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5').flush(detail);
    await fixture.whenStable();
    // Until the quote part has loaded, the page is laid out but not shown, and the bar still runs.
    shownBeforeQuote = {
      hidden: page.querySelector('[data-testid="portal-content"]')!.classList.contains('waiting'),
      bar: page.querySelector('mat-progress-bar')?.getAttribute('aria-label') ?? null,
    };
    // The quote section loads its own data (see quotes/client-quote.spec.ts).
    httpMock.expectOne('/api/commissions/5/quotes').flush({ items: [] });
    httpMock.expectOne('/api/commissions/5/payments').flush({ items: [], due: null });
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it('shows the page whole once the quote part has loaded, so nothing jumps down', () => {
    expect(shownBeforeQuote).toEqual({ hidden: true, bar: 'Loading your commission' });
    expect(page.querySelector('[data-testid="portal-content"]')!.classList.contains('waiting')).toBeFalse();
    expect(page.querySelector('mat-progress-bar')).toBeNull();
  });

  it('shows the stage on a progress line, in words as well as marks', () => {
    expect(page.querySelector('[data-testid="portal-stage"]')?.textContent).toContain(
      'Now at: Preparation (wash, press, stabilise) (step 5 of 11)',
    );
    const steps = Array.from(page.querySelectorAll('.progress-line li'));
    expect(steps.length).toBe(11);
    const current = steps.filter((li) => li.getAttribute('aria-current') === 'step');
    expect(current.map((li) => li.textContent?.trim())).toEqual([jasmine.stringContaining('Preparation')]);
    expect(steps[0].textContent).toContain('(done)');
  });

  it('leads the client to their design and their care card', async () => {
    const href = async (text: string) => (await (await loader.getHarness(MatButtonHarness.with({ text }))).host()).getAttribute('href');
    expect(await href('See the design')).toBe('/designs/5/review');
    expect(await href('Care card')).toBe('/designs/5/care-card');
  });

  it('adds a garment with only the fields a client may send, then sends its chosen photos', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a garment/ }))).click();
    await fixture.whenStable();
    const type = async (label: string, text: string) =>
      (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!.setValue(text);
    await type('What it is', 'Grey wool cardigan');
    await type('Its story', 'Knitted for the allotment.');
    // The fields stop at the server's own limits, so a long story is never refused in silence.
    const limit = (name: string) => page.querySelector<HTMLInputElement | HTMLTextAreaElement>(`[formcontrolname="${name}"]`)!.maxLength;
    expect([limit('description'), limit('whose'), limit('story'), limit('colour')]).toEqual([300, 200, 5000, 100]);

    const photo = new File([new Uint8Array(500)], 'cardigan.jpg', { type: 'image/jpeg' });
    const input = page.querySelector<HTMLInputElement>('input[type=file]')!;
    const files = new DataTransfer();
    files.items.add(photo);
    input.files = files.files;
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    httpMock.expectNone((r) => r.url.includes('/photos'));

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save garment' }))).click();
    const create = httpMock.expectOne('/api/commissions/5/garments');
    expect(create.request.body).toEqual({ description: 'Grey wool cardigan', story: 'Knitted for the allotment.' });
    create.flush({ id: 30, description: 'Grey wool cardigan', status: 'expected' }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();

    const upload = httpMock.expectOne('/api/garments/30/photos');
    expect((upload.request.body as FormData).get('photos')).toEqual(jasmine.any(File));
    upload.flush({ items: [] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(page.textContent).toContain('“Grey wool cardigan” is added.');
  });

  it('adds photos with a note to a garment already logged, the note sent with each photo', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add photos and a note to “Blue oxford work shirt”/ }))).click();
    await fixture.whenStable();
    const note = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'A note with these photos' }))).getControl(MatInputHarness))!;
    await note.setValue('  The pocket with his pen mark: please keep it  ');
    expect(page.querySelector<HTMLTextAreaElement>('[data-testid="add-photos"] textarea')!.maxLength).toBe(500);

    const input = page.querySelector<HTMLInputElement>('[data-testid="add-photos"] input[type=file]')!;
    const files = new DataTransfer();
    files.items.add(new File([new Uint8Array(500)], 'pocket.jpg', { type: 'image/jpeg' }));
    input.files = files.files;
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();

    const upload = httpMock.expectOne('/api/garments/8/photos');
    const body = upload.request.body as FormData;
    expect(body.get('photos')).toEqual(jasmine.any(File));
    expect(body.get('caption')).toBe('The pocket with his pen mark: please keep it');
    upload.flush({ items: [{ id: 70, kind: 'garment', garmentId: 8, caption: 'The pocket with his pen mark: please keep it', originalName: 'pocket.jpg', width: 20, height: 20, url: '/api/photos/70/image', thumbUrl: '/api/photos/70/thumb', createdAt: '2026-12-04T10:00:00Z' }] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(page.textContent).toContain('One photo added to “Blue oxford work shirt”. Thank you!');

    // Done reads the commission again, so the new photo shows under the garment.
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Done' }))).click();
    httpMock.expectOne('/api/commissions/5').flush(detail);
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="add-photos"]')).toBeNull();
  });
});
