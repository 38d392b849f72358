import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { CommissionDetail } from './commission';
import { CommissionForm, toPence } from './commission-form';

describe('CommissionForm', () => {
  let fixture: ComponentFixture<CommissionForm>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [CommissionForm],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(CommissionForm);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    httpMock
      .expectOne((r) => r.url === '/api/clients')
      .flush({ items: [{ id: 4, name: 'Imogen Tallis' }], total: 1 });
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const select = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label })).then((f) => f.getControl(MatSelectHarness));
  async function type(label: string, text: string): Promise<void> {
    const control = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness);
    await control!.setValue(text);
    await fixture.whenStable();
  }

  it('turns pounds into whole pence without rounding drift', () => {
    expect(toPence('450')).toBe(45000);
    expect(toPence('450.5')).toBe(45050);
    expect(toPence('0.29')).toBe(29);
  });

  it('shows the safe-sleep caution as soon as the piece is for a baby under 12 months', async () => {
    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelector('[data-testid="caution-safe_sleep"]')).toBeNull();
    await (await select('Age group'))!.clickOptions({ text: 'Baby under 12 months' });
    await fixture.whenStable();
    const card = page.querySelector('[data-testid="caution-safe_sleep"]');
    expect(card?.getAttribute('role')).toBe('note');
    expect(card?.textContent).toContain('Safe sleep for babies under 12 months');
  });

  it('sends the size as typed with its unit, the deadline as a plain date and the budget in pence', async () => {
    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    await (await select('Client'))!.clickOptions({ text: 'Imogen Tallis' });
    await type('Title', 'Grandad’s shirts quilt');
    await type('Width', '60 1/2');
    await type('Length', '80');
    await type('Deadline', '01/03/2027');
    await type('Budget', '450.50');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Open commission' }))).click();

    const request = httpMock.expectOne('/api/commissions');
    expect(request.request.body).toEqual(
      jasmine.objectContaining({
        clientId: 4,
        title: 'Grandad’s shirts quilt',
        width: '60 1/2',
        length: '80',
        unit: 'in',
        deadline: '2027-03-01',
        budgetPence: 45050,
      }),
    );
    request.flush({ id: 9, clientId: 4, title: 'Grandad’s shirts quilt', kind: 'memory_quilt', ageGroup: 'adult', stage: 'enquiry', createdAt: '2026-12-01T10:00:00Z' }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/commissions', 9]);
  });

  it("refuses a width the parser cannot read, with the parser's message", async () => {
    await type('Width', 'sixty');
    const width = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Width' }));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Open commission' }))).click();
    expect((await width.getTextErrors())[0]).toContain('That is not a length.');
    httpMock.expectNone('/api/commissions');
  });
});

describe('CommissionForm editing', () => {
  let fixture: ComponentFixture<CommissionForm>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let navigate: jasmine.Spy;

  const stored: CommissionDetail = {
    id: 3,
    clientId: 4,
    client: { id: 4, name: 'Imogen Tallis' },
    title: 'Grandad’s shirts quilt',
    kind: 'memory_quilt',
    recipient: 'Rosa',
    ageGroup: 'adult',
    occasion: 'Ruby wedding',
    sizePreset: 'UK double',
    // 60 1/2 in and 80 in, as typed when the commission was opened.
    widthMm: '1536.7',
    lengthMm: '2032',
    deadline: '2027-03-01',
    stage: 'booked',
    notes: 'Keep the breast pockets whole.',
    budgetPence: 45050,
    createdAt: '2026-10-01T09:00:00Z',
    cautions: [],
    garments: [],
    progressPhotos: [],
    stageHistory: [],
    facts: { garmentCount: 0, garmentsReceived: 0 },
  };

  async function open(commission: CommissionDetail): Promise<void> {
    TestBed.configureTestingModule({
      imports: [CommissionForm],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(CommissionForm);
    fixture.componentRef.setInput('id', '3');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    await fixture.whenStable();
    // No client list is fetched: the client cannot be changed.
    httpMock.expectOne('/api/commissions/3').flush(commission);
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  const input = async (label: string) =>
    (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;
  const select = async (label: string) =>
    (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatSelectHarness))!;
  const save = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();

  it('fills the form from the commission, sizes as typed lengths and the budget in pounds', async () => {
    await open(stored);
    expect(await (await input('Client')).getValue()).toBe('Imogen Tallis');
    expect(await (await input('Client')).isReadonly()).toBeTrue();
    expect(await (await input('Title')).getValue()).toBe('Grandad’s shirts quilt');
    expect(await (await select('Kind')).getValueText()).toBe('Memory quilt');
    expect(await (await input('Who it is for')).getValue()).toBe('Rosa');
    expect(await (await input('Occasion')).getValue()).toBe('Ruby wedding');
    expect(await (await input('Size preset')).getValue()).toBe('UK double');
    expect(await (await input('Width')).getValue()).toBe('60 1/2');
    expect(await (await input('Length')).getValue()).toBe('80');
    expect(await (await select('Unit')).getValueText()).toBe('in');
    expect(await (await input('Deadline')).getValue()).toBe('01/03/2027');
    expect(await (await input('Budget')).getValue()).toBe('450.50');
    expect(await (await input('Notes')).getValue()).toBe('Keep the breast pockets whole.');
  });

  it('shows a size that is not on an eighth-inch mark back in centimetres', async () => {
    await open({ ...stored, widthMm: '1500', lengthMm: '2005' });
    expect(await (await select('Unit')).getValueText()).toBe('cm');
    expect(await (await input('Width')).getValue()).toBe('150');
    expect(await (await input('Length')).getValue()).toBe('200.5');
  });

  it('sends only the fields that changed, then returns to the commission', async () => {
    await open(stored);
    await (await input('Title')).setValue('Grandad’s shirt quilt');
    await (await input('Budget')).setValue('500');
    await (await input('Occasion')).setValue('');
    await save();
    const request = httpMock.expectOne('/api/commissions/3');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ title: 'Grandad’s shirt quilt', occasion: null, budgetPence: 50000 });
    request.flush({ ...stored, title: 'Grandad’s shirt quilt', occasion: null, budgetPence: 50000 });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/commissions', 3]);
  });

  it('sends a changed width as typed with its unit, and both lengths when the unit changes', async () => {
    await open(stored);
    await (await input('Width')).setValue('62');
    await save();
    const widthOnly = httpMock.expectOne('/api/commissions/3');
    expect(widthOnly.request.body).toEqual({ width: '62', unit: 'in' });
    widthOnly.flush({ error: { code: 'validation', message: 'The commission has a field to correct.' } }, { status: 500, statusText: 'Server Error' });
    await fixture.whenStable();

    await (await select('Unit')).clickOptions({ text: 'cm' });
    await save();
    expect(httpMock.expectOne('/api/commissions/3').request.body).toEqual({ width: '62', length: '80', unit: 'cm' });
  });

  it('sends a deadline typed in the studio order as YYYY-MM-DD, and a cleared one as none', async () => {
    await open(stored);
    await (await input('Deadline')).setValue('15/02/2027');
    await save();
    const moved = httpMock.expectOne('/api/commissions/3');
    expect(moved.request.body).toEqual({ deadline: '2027-02-15' });
    moved.flush({ error: { code: 'validation', message: 'Try again.' } }, { status: 500, statusText: 'Server Error' });
    await fixture.whenStable();

    await (await input('Deadline')).setValue('');
    await save();
    expect(httpMock.expectOne('/api/commissions/3').request.body).toEqual({ deadline: null });
  });

  it('keeps a deadline that is not a date as typed, says how to type it and sends nothing', async () => {
    await open(stored);
    await (await input('Deadline')).setValue('30/02/2027');
    await save();
    httpMock.expectNone('/api/commissions/3');
    const deadline = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Deadline' }));
    expect(await deadline.getTextErrors()).toEqual(['Type the date as DD/MM/YYYY, with a four-digit year, or pick it from the calendar']);
    expect(await (await input('Deadline')).getValue()).toBe('30/02/2027');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('sends nothing when nothing changed', async () => {
    await open(stored);
    await save();
    httpMock.expectNone('/api/commissions/3');
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Nothing has changed yet.');
  });

  it("puts the server's field messages under their fields", async () => {
    await open(stored);
    await (await input('Width')).setValue('3000 cm');
    await save();
    httpMock.expectOne('/api/commissions/3').flush(
      { error: { code: 'validation', message: 'The commission has a field to correct.', fields: { width: 'Width must be at most 100 m.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const width = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Width' }));
    expect(await width.getTextErrors()).toEqual(['Width must be at most 100 m.']);
    expect(navigate).not.toHaveBeenCalled();
  });
});

describe('CommissionForm: opened from a client’s page', () => {
  it('chooses the client named in ?client= once the clients have loaded', async () => {
    TestBed.configureTestingModule({
      imports: [CommissionForm],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs('owner'), { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) }],
    });
    const fixture = TestBed.createComponent(CommissionForm);
    fixture.componentRef.setInput('client', '9');
    const httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    httpMock.expectOne((r) => r.url === '/api/clients').flush({ items: [{ id: 4, name: 'Imogen Tallis' }, { id: 9, name: 'Ida Hartley' }], total: 2 });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const client = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Client' }))).getControl(MatSelectHarness);
    expect(await client!.getValueText()).toBe('Ida Hartley');
    httpMock.verify();
  });
});
