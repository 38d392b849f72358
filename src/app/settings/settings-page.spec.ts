import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';

import { CurrentLocale } from '../core/current-locale';
import { Notices } from '../core/notices';
import { SettingsPage } from './settings-page';
import { BLOCK_KINDS } from './studio-settings';

const stored = {
  id: 1,
  studioName: 'Larkspur Bobbin Room',
  makerName: 'Maren Oakhollow',
  address: 'The Loft, 3 Bobbin Yard',
  email: 'hello@larkspur.test',
  hourlyRatePence: 2800,
  vatRegistered: false,
  vatRate: '20',
  vatMode: 'line',
  vatNumber: null,
  depositPercent: '30.00',
  validityDays: 30,
  paymentTerms: 'A deposit books your commission.',
  blockMinutes: { square: 6, hst: 12 },
  remindQuoteExpiry: true,
  remindBalanceDue: true,
  remindGarmentsLate: true,
  garmentsLateDays: 14,
  calendarFeedMadeAt: null as string | null,
  locale: 'en-GB',
  updatedAt: '2026-12-01T10:00:00Z',
};

describe('SettingsPage', () => {
  let fixture: ComponentFixture<SettingsPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SettingsPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(SettingsPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/settings').flush(stored);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = async (label: string) => (await (await field(label)).getControl(MatInputHarness))!;
  const errors = async (label: string) => (await field(label)).getTextErrors();

  it('shows the stored settings, the hourly rate in pounds', async () => {
    expect(await (await input('Studio name')).getValue()).toBe('Larkspur Bobbin Room');
    expect(await (await input('Hourly rate (£)')).getValue()).toBe('28.00');
    expect(await (await input('Deposit (%)')).getValue()).toBe('30');
    expect((page.querySelector('#minutes-hst') as HTMLInputElement).value).toBe('12');
    expect((page.querySelector('#minutes-fan') as HTMLInputElement).value).toBe('0');
  });

  it('says what to fix under each field and sends nothing while something is wrong', async () => {
    await (await input('Studio name')).setValue('');
    await (await input('Hourly rate (£)')).setValue('twenty');
    await (await input('E-mail')).setValue('hello-at-larkspur');
    await (await input('Deposit (%)')).setValue('120');
    await (await input('Quote valid for (days)')).setValue('0');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    await fixture.whenStable();

    httpMock.expectNone({ method: 'PATCH' });
    expect(await errors('Studio name')).toEqual(['Give the studio a name']);
    expect(await errors('Hourly rate (£)')).toEqual(['Enter pounds and pence, like 28.50']);
    expect(await errors('E-mail')).toEqual(['Enter an e-mail address like name@example.com']);
    expect(await errors('Deposit (%)')).toEqual(['The deposit is 0 to 100 percent']);
    expect(await errors('Quote valid for (days)')).toEqual(['A whole number of days from 1 to 365']);
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('see the messages under the fields');
  });

  it('saves pounds as pence, the deposit as a number, VAT settings and the minutes of every block kind', async () => {
    await (await input('Hourly rate (£)')).setValue('30.50');
    await (await input('Deposit (%)')).setValue('25');
    await (await loader.getHarness(MatSlideToggleHarness.with({ label: 'VAT registered' }))).check();
    await fixture.whenStable();
    await (await (await field('VAT rate')).getControl(MatSelectHarness))!.clickOptions({ text: '5% (reduced)' });
    await (await input('VAT number')).setValue('GB123456789');
    (page.querySelector('input[value="invoice"]') as HTMLInputElement).click();
    const fan = page.querySelector('#minutes-fan') as HTMLInputElement;
    fan.value = '45';
    fan.dispatchEvent(new Event('input'));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();

    const request = httpMock.expectOne({ method: 'PATCH', url: '/api/settings' });
    expect(request.request.body).toEqual(
      jasmine.objectContaining({
        hourlyRatePence: 3050,
        depositPercent: 25,
        vatRegistered: true,
        vatRate: '5',
        vatMode: 'invoice',
        vatNumber: 'GB123456789',
        email: 'hello@larkspur.test',
        validityDays: 30,
        // Every kind of the registry, 0 where nothing is stored or typed.
        blockMinutes: { ...Object.fromEntries(BLOCK_KINDS.map((kind) => [kind, 0])), square: 6, hst: 12, fan: 45 },
      }),
    );
    request.flush({ ...stored, hourlyRatePence: 3050, depositPercent: '25.00', vatRegistered: true, vatRate: '5', vatMode: 'invoice' });
    await fixture.whenStable();
    expect(await (await input('Hourly rate (£)')).getValue()).toBe('30.50');
  });

  it('saves the locale picked and has the date fields follow it at once', async () => {
    const locale = await (await field('Locale')).getControl(MatSelectHarness);
    expect(await locale!.getValueText()).toBe('English (UK): 31/12/2026');
    await locale!.open();
    expect((await Promise.all((await locale!.getOptions()).map((o) => o.getText())))).toEqual([
      'English (UK): 31/12/2026',
      'English (US): 12/31/2026',
      'English (Ireland): 31/12/2026',
      'English (Canada): 2026-12-31',
      'Japanese (Japan): 2026/12/31',
    ]);
    await locale!.clickOptions({ text: 'English (US): 12/31/2026' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();

    const request = httpMock.expectOne({ method: 'PATCH', url: '/api/settings' });
    expect(request.request.body).toEqual(jasmine.objectContaining({ locale: 'en-US' }));
    expect(TestBed.inject(CurrentLocale).locale()).toBe('en-GB');
    request.flush({ ...stored, locale: 'en-US' });
    await fixture.whenStable();
    expect(TestBed.inject(CurrentLocale).locale()).toBe('en-US');
  });

  it("puts the server's message about the locale under it", async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    httpMock.expectOne({ method: 'PATCH' }).flush(
      { error: { code: 'validation', message: 'Check the settings.', fields: { locale: 'Pick the studio locale from the list: en-GB, en-US, en-IE, en-CA, ja-JP.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await errors('Locale')).toEqual(['Pick the studio locale from the list: en-GB, en-US, en-IE, en-CA, ja-JP.']);
    expect(TestBed.inject(CurrentLocale).locale()).toBe('en-GB');
  });

  it("puts the server's field message under the field it belongs to", async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    httpMock.expectOne({ method: 'PATCH' }).flush(
      { error: { code: 'validation', message: 'Check the settings.', fields: { hourlyRatePence: 'The hourly rate cannot be negative.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await errors('Hourly rate (£)')).toEqual(['The hourly rate cannot be negative.']);
  });

  it('saves the reminder switches and the days before a garment reminder, and refuses a bad number of days', async () => {
    await (await loader.getHarness(MatSlideToggleHarness.with({ label: /garments not yet arrived/ }))).uncheck();
    await (await input('Garments reminder after (days)')).setValue('0');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    await fixture.whenStable();
    httpMock.expectNone({ method: 'PATCH' });
    expect(await errors('Garments reminder after (days)')).toEqual(['A whole number of days from 1 to 365']);

    await (await input('Garments reminder after (days)')).setValue('21');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    const request = httpMock.expectOne({ method: 'PATCH', url: '/api/settings' });
    expect(request.request.body).toEqual(jasmine.objectContaining({ remindQuoteExpiry: true, remindBalanceDue: true, remindGarmentsLate: false, garmentsLateDays: 21 }));
    request.flush({ ...stored, remindGarmentsLate: false, garmentsLateDays: 21 });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatSlideToggleHarness.with({ label: /garments not yet arrived/ }))).isChecked()).toBeFalse();
  });

  it('shows a new calendar feed address once, and says the old one stops working when making another', async () => {
    expect(page.textContent).toContain('There is no feed address yet.');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Make a feed address' }))).click();
    httpMock.expectOne({ method: 'POST', url: '/api/settings/calendar-feed' }).flush({ url: 'http://studio.test/api/calendar/abc.ics', madeAt: '2026-12-04T20:00:00Z' });
    await fixture.whenStable();
    expect(await (await input('Feed address')).getValue()).toBe('http://studio.test/api/calendar/abc.ics');
    expect(await loader.getHarness(MatButtonHarness.with({ text: 'Make a new address (the old one stops working)' }))).toBeTruthy();

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Turn the feed off' }))).click();
    httpMock.expectOne({ method: 'DELETE', url: '/api/settings/calendar-feed' }).flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(page.textContent).toContain('There is no feed address yet.');
    expect(page.textContent).not.toContain('/api/calendar/abc.ics');
  });
});
