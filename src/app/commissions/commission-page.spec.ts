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
import { cautionsFor, stageOptions } from '@keepstitch/shared';

import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { CommissionDetail } from './commission';
import { CommissionPage } from './commission-page';

const detail: CommissionDetail = {
  id: 3,
  clientId: 4,
  client: { id: 4, name: 'Imogen Tallis' },
  title: 'Cot hanging from baby clothes',
  kind: 'wall_hanging',
  recipient: 'Baby Ada',
  ageGroup: 'baby_under_1',
  occasion: null,
  sizePreset: null,
  widthMm: null,
  lengthMm: null,
  deadline: '2027-02-01',
  daysLeft: 61,
  overdue: false,
  stage: 'booked',
  createdAt: '2026-10-01T09:00:00Z',
  cautions: cautionsFor('baby_under_1'),
  garments: [
    { id: 21, description: 'Sleepsuit with ducks', whose: 'Ada', fibre: 'cotton', status: 'in_studio', place: 'Box 2', photos: [] },
  ],
  progressPhotos: [],
  stageHistory: [{ id: 1, fromStage: null, toStage: 'enquiry', note: 'Opened', movedAt: '2026-10-01T09:00:00Z' }],
  hours: {
    entries: [
      { id: 7, stage: 'enquiry', hours: '0.50', workedOn: '2026-10-02', note: 'First call', userName: 'Ottilie Marsh' },
      { id: 9, stage: 'booked', hours: '0.25', workedOn: '2026-11-20', note: null, userName: 'Wren Ashby' },
      { id: 8, stage: 'booked', hours: '1.25', workedOn: '2026-11-20', note: 'Sorted the shirts', userName: 'Ottilie Marsh' },
    ],
    byStage: { enquiry: '0.50', booked: '1.50' },
    total: '2.00',
  },
  // As the server gives it to the owner: the trial's 18.25 h quoted at £30 against 21.5 h logged.
  hoursCompared: {
    quoteId: 12,
    quoteVersion: 2,
    quoteStatus: 'accepted',
    hourlyRatePence: 3000,
    stages: [
      { stage: 'preparation', quotedHours: '3.00', loggedHours: '2.50', differenceHours: '-0.50', quotedPence: 9000, loggedCostPence: 7500, marginPence: 1500 },
      { stage: 'piecing', quotedHours: '10.00', loggedHours: '13.50', differenceHours: '3.50', quotedPence: 30000, loggedCostPence: 40500, marginPence: -10500 },
      { stage: 'quilting', quotedHours: '4.00', loggedHours: '4.50', differenceHours: '0.50', quotedPence: 12000, loggedCostPence: 13500, marginPence: -1500 },
      { stage: 'binding', quotedHours: '1.25', loggedHours: '1.00', differenceHours: '-0.25', quotedPence: 3750, loggedCostPence: 3000, marginPence: 750 },
    ],
    total: { quotedHours: '18.25', loggedHours: '21.50', differenceHours: '3.25', quotedPence: 54750, loggedCostPence: 64500, marginPence: -9750 },
  },
  nextStages: ['enquiry', 'quoted', 'garments_in', 'cancelled'],
  stageOptions: stageOptions('booked', { garmentCount: 1, garmentsReceived: 1 }),
  facts: { garmentCount: 1, garmentsReceived: 1 },
};

const studioSettings = {
  studioName: 'Test studio',
  makerName: 'Ottilie Marsh',
  address: '',
  email: null,
  hourlyRatePence: 2500,
  vatRegistered: false,
  vatRate: '20',
  vatMode: 'line',
  vatNumber: null,
  depositPercent: '30',
  validityDays: 30,
  paymentTerms: '',
  blockMinutes: {},
  remindQuoteExpiry: true,
  remindBalanceDue: true,
  remindGarmentsLate: true,
  garmentsLateDays: 14,
  calendarFeedMadeAt: null,
  locale: 'en-GB',
};

describe('CommissionPage', () => {
  let fixture: ComponentFixture<CommissionPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [CommissionPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(CommissionPage);
    fixture.componentRef.setInput('id', '3');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/3').flush(detail);
    await fixture.whenStable();
    // The owner's quote section loads its own data (see quotes/).
    httpMock.expectOne('/api/commissions/3/quotes').flush({ items: [] });
    httpMock.expectOne('/api/commissions/3/payments').flush({ items: [], due: null });
    httpMock.expectOne('/api/settings').flush(studioSettings);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  async function field(label: string) {
    return loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  }

  it('shows the safe-sleep caution as a note with its source, and the garments', () => {
    const card = page.querySelector('[data-testid="caution-safe_sleep"]');
    expect(card?.getAttribute('role')).toBe('note');
    expect(card?.textContent).toContain('AAP safe-sleep policy');
    const rows = page.querySelectorAll('[data-testid="garment-row"]');
    expect(rows.length).toBe(1);
    expect(rows[0].textContent).toContain('In the studio');
    expect(rows[0].textContent).toContain('Box 2');
  });

  it('asks for a note before moving back a stage, then sends it', async () => {
    const next = (await (await field('Next stage')).getControl(MatSelectHarness))!;
    await next.clickOptions({ text: 'Enquiry' });
    await fixture.whenStable();
    const move = await loader.getHarness(MatButtonHarness.with({ text: 'Move to stage' }));
    await move.click();
    httpMock.expectNone('/api/commissions/3/stage');
    expect(await (await field('Note')).getTextErrors()).toEqual(['Say why it goes back or is cancelled']);

    await (await (await field('Note')).getControl(MatInputHarness))!.setValue('Client wants to rethink the size');
    await move.click();
    const request = httpMock.expectOne('/api/commissions/3/stage');
    expect(request.request.body).toEqual({ to: 'enquiry', note: 'Client wants to rethink the size' });
    request.flush({ id: 3, stage: 'enquiry', nextStages: [] });
    httpMock.expectOne('/api/commissions/3').flush({ ...detail, stage: 'enquiry' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="current-stage"]')?.textContent).toContain('Enquiry');
  });

  it('lists a stage not allowed yet as disabled, with the reason in its text', async () => {
    const next = (await (await field('Next stage')).getControl(MatSelectHarness))!;
    await next.open();
    const options = await next.getOptions();
    const texts = await Promise.all(options.map((o) => o.getText()));
    expect(texts).toContain('Garments in');
    const cutting = options[texts.findIndex((t) => t.startsWith('Cutting'))]!;
    expect(await cutting.getText()).toBe('Cutting (not now: "Cutting" comes after "Garments in": move to that stage first.)');
    expect(await cutting.isDisabled()).toBeTrue();
    const garmentsIn = options[texts.indexOf('Garments in')]!;
    expect(await garmentsIn.isDisabled()).toBeFalse();
    // The current stage is not offered.
    expect(texts.some((t) => t.startsWith('Booked'))).toBeFalse();
  });

  it("shows the server's reason when a move forward is refused", async () => {
    const next = (await (await field('Next stage')).getControl(MatSelectHarness))!;
    await next.clickOptions({ text: 'Garments in' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Move to stage' }))).click();
    httpMock.expectOne('/api/commissions/3/stage').flush(
      { error: { code: 'stage_refused', message: 'Record at least one garment as received first.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(page.textContent).toContain('Record at least one garment as received first.');
  });

  it('logs hours in quarter steps and refuses other amounts', async () => {
    const hours = (await (await field('Hours')).getControl(MatInputHarness))!;
    await hours.setValue('1.3');
    const log = await loader.getHarness(MatButtonHarness.with({ text: 'Log hours' }));
    await log.click();
    httpMock.expectNone('/api/commissions/3/hours');
    expect(await (await field('Hours')).getTextErrors()).toEqual(['Quarter hours from 0.25 to 24']);

    await hours.setValue('1.75');
    const day = (await (await field('Date')).getControl(MatInputHarness))!;
    await day.setValue('31/11/2026');
    await log.click();
    httpMock.expectNone('/api/commissions/3/hours');
    expect(await (await field('Date')).getTextErrors()).toEqual(['Type the date as DD/MM/YYYY, with a four-digit year, or pick it from the calendar']);
    await day.setValue('30/11/2026');
    await log.click();
    const request = httpMock.expectOne('/api/commissions/3/hours');
    expect(request.request.body).toEqual({ stage: 'booked', hours: 1.75, workedOn: '2026-11-30' });
    request.flush({}, { status: 201, statusText: 'Created' });
    httpMock.expectOne('/api/commissions/3').flush(detail);
  });

  it('lists every hours entry under the totals, newest first, with stage, hours, who and note', () => {
    const rows = Array.from(page.querySelectorAll('[data-testid="hours-entry"]')).map((row) =>
      Array.from(row.querySelectorAll('td')).map((td) => td.textContent?.trim()),
    );
    expect(rows).toEqual([
      ['20 Nov 2026', 'Booked', '0.25', 'Wren Ashby', ''],
      ['20 Nov 2026', 'Booked', '1.25', 'Ottilie Marsh', 'Sorted the shirts'],
      ['2 Oct 2026', 'Enquiry', '0.50', 'Ottilie Marsh', 'First call'],
    ]);
    const totals = page.querySelector('table.totals')!;
    expect(totals.compareDocumentPosition(page.querySelector('table.entries')!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('offers the owner an Edit button to the edit page', async () => {
    const edit = await loader.getHarness(MatButtonHarness.with({ selector: '[href="/commissions/3/edit"]' }));
    expect(await edit.getText()).toMatch(/Edit$/);
  });

  it('shows the owner quoted against logged hours per stage, the difference and the margin', () => {
    const cells = (row: Element) => Array.from(row.querySelectorAll('td, th')).map((c) => c.textContent?.trim());
    const rows = Array.from(page.querySelectorAll<HTMLElement>('[data-testid="hours-compared"]')).map(cells);
    expect(rows).toEqual([
      ['Preparation (wash, press, stabilise)', '3.00', '2.50', '-0.50', '£15.00'],
      ['Piecing', '10.00', '13.50', '+3.50', '-£105.00'],
      ['Quilting', '4.00', '4.50', '+0.50', '-£15.00'],
      ['Binding and label', '1.25', '1.00', '-0.25', '£7.50'],
    ]);
    expect(cells(page.querySelector('[data-testid="hours-compared-total"]')!)).toEqual(['Total', '18.25', '21.50', '+3.25', '-£97.50']);
    expect(page.querySelector('#hours-compared-basis')?.textContent).toContain('Against quote version 2 (accepted). The margin is the labour quoted less the hours logged at £30.00 an hour.');
  });
});

describe('CommissionPage for the workroom', () => {
  it('has no Edit button: only the owner changes a commission', async () => {
    TestBed.configureTestingModule({
      imports: [CommissionPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('workroom'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    const fixture = TestBed.createComponent(CommissionPage);
    fixture.componentRef.setInput('id', '3');
    const httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    // The server sends the workroom no hours compared with the quote.
    httpMock.expectOne('/api/commissions/3').flush({ ...detail, hoursCompared: undefined });
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelector('[data-testid="current-stage"]')).not.toBeNull();
    expect(page.querySelector('#hours-compared-heading')).toBeNull();
    expect(page.querySelector('a[href="/commissions/3/edit"]')).toBeNull();
    httpMock.verify();
  });
});
