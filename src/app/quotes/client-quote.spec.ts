import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { cautionsFor } from '@keepstitch/shared';

import { ExternalNavigation } from '../core/external-navigation';
import { Notices } from '../core/notices';
import { ClientQuote, PAYMENT_POLL } from './client-quote';
import { Payments, Quote } from './quote';

const sent: Quote = {
  id: 12,
  commissionId: 5,
  version: 1,
  status: 'sent',
  intro: 'Here is what making your cushions involves.',
  validUntil: '2027-01-10',
  expired: false,
  depositPercent: 30,
  vatRate: null,
  vatMode: 'line',
  lines: [
    { kind: 'labour', description: 'Two cushion covers', quantity: '6', unit: 'hours', unitPricePence: 2800, netPence: 16800, vatPence: 0 },
    { kind: 'material', description: 'Cushion pads', quantity: '2', unit: 'pads', unitPricePence: 850, netPence: 1700, vatPence: 0 },
  ],
  totals: { netPence: 18500, vatPence: 0, totalPence: 18500, depositPence: 5550, balancePence: 12950 },
  sentAt: '2026-12-01T10:00:00Z',
  acceptedAt: null,
  acceptedName: null,
  declinedAt: null,
  declineNote: null,
  createdAt: '2026-11-30T10:00:00Z',
};
const accepted: Quote = { ...sent, status: 'accepted', acceptedAt: '2026-12-02T10:00:00Z', acceptedName: 'Cass Penrose' };
const owing: Payments = { items: [], due: { depositPence: 5550, depositPaid: false, balancePence: 18500, balancePaid: false, quoteId: 12 } };
const depositPaid: Payments = {
  items: [{ id: 3, kind: 'deposit', amountPence: 5550, status: 'paid', paidAt: '2026-12-02T10:05:00Z' }],
  due: { depositPence: 5550, depositPaid: true, balancePence: 12950, balancePaid: false, quoteId: 12 },
};

describe('ClientQuote', () => {
  let fixture: ComponentFixture<ClientQuote>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;
  let navigation: jasmine.SpyObj<ExternalNavigation>;

  async function open(quotes: Quote[], payments: Payments, inputs: Record<string, string> = {}): Promise<void> {
    fixture = TestBed.createComponent(ClientQuote);
    fixture.componentRef.setInput('commissionId', 5);
    fixture.componentRef.setInput('cautions', cautionsFor('child_under_3'));
    for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
    loader = TestbedHarnessEnvironment.loader(fixture);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/quotes').flush({ items: quotes });
    httpMock.expectOne('/api/commissions/5/payments').flush(payments);
    await fixture.whenStable();
  }

  beforeEach(() => {
    navigation = jasmine.createSpyObj<ExternalNavigation>('ExternalNavigation', ['goTo']);
    TestBed.configureTestingModule({
      imports: [ClientQuote],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: ExternalNavigation, useValue: navigation },
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    httpMock = TestBed.inject(HttpTestingController);
    sessionStorage.removeItem('keepstitch.paying.5');
  });

  it('tells its page once when the first load has ended, even when it failed, and not on a later reload', async () => {
    fixture = TestBed.createComponent(ClientQuote);
    fixture.componentRef.setInput('commissionId', 5);
    let ended = 0;
    fixture.componentInstance.firstLoadEnded.subscribe(() => ended++);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/quotes').flush({ message: 'down' }, { status: 503, statusText: 'Service Unavailable' });
    httpMock.match('/api/commissions/5/payments');
    await fixture.whenStable();
    expect(ended).toBe(1);
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Your quote could not be loaded.');

    loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    httpMock.expectOne('/api/commissions/5/quotes').flush({ items: [] });
    httpMock.expectOne('/api/commissions/5/payments').flush({ items: [], due: null });
    await fixture.whenStable();
    expect(ended).toBe(1);
  });

  afterEach(() => httpMock?.verify());

  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  const nameField = () => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Your full name' }));

  it('shows the sent quote with its lines, totals, validity date, cautions and PDF', async () => {
    await open([sent], { items: [], due: null });
    expect(page.textContent).toContain('valid until 10 Jan 2027');
    expect(page.querySelectorAll('[data-testid="quote-line"]').length).toBe(2);
    expect(page.querySelector('[data-testid="total-total"]')?.textContent).toBe('£185.00');
    expect(page.querySelector('[data-testid="total-vat"]')?.textContent).toBe('None charged');
    expect(page.querySelector('[data-testid="caution-small_parts"]')).not.toBeNull();
    expect(page.querySelector('a[href="/api/quotes/12/pdf"]')?.textContent).toContain('Download PDF');
  });

  it('accepts only with a typed name, and sends that name', async () => {
    await open([sent], { items: [], due: null });
    await (await button('Accept quote')).click();
    httpMock.expectNone('/api/quotes/12/accept');
    expect(await (await nameField()).getTextErrors()).toEqual(['Type your name to accept the quote']);

    await (await (await nameField()).getControl(MatInputHarness))!.setValue('  Cass Penrose ');
    await (await button('Accept quote')).click();
    const request = httpMock.expectOne({ method: 'POST', url: '/api/quotes/12/accept' });
    expect(request.request.body).toEqual({ name: 'Cass Penrose' });
    request.flush(accepted);
    httpMock.expectOne('/api/commissions/5/payments').flush(owing);
    await fixture.whenStable();
    expect(page.textContent).toContain('accepted by Cass Penrose');
    expect(await (await button(/Pay deposit/)).getText()).toContain('£55.50');
  });

  it('answered already in another tab: says so and shows the quote as it now stands, ready for the deposit', async () => {
    await open([sent], { items: [], due: null });
    await (await (await nameField()).getControl(MatInputHarness))!.setValue('Cass Penrose');
    await (await button('Accept quote')).click();
    httpMock
      .expectOne({ method: 'POST', url: '/api/quotes/12/accept' })
      .flush({ error: { code: 'already_accepted', message: 'You have already accepted this quote.' } }, { status: 409, statusText: 'Conflict' });
    httpMock.expectOne('/api/commissions/5/quotes').flush({ items: [accepted] });
    httpMock.expectOne('/api/commissions/5/payments').flush(owing);
    await fixture.whenStable();
    expect(page.textContent).toContain('You have already accepted this quote.');
    expect(await (await button(/Pay deposit/)).getText()).toContain('£55.50');
    expect(page.textContent).not.toContain('Accept this quote');
  });

  it('sends a decline with its optional note', async () => {
    await open([sent], { items: [], due: null });
    await (await button('Decline')).click();
    const note = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=note]' }));
    await note.setValue('Could it be one cushion instead?');
    await (await button('Decline quote')).click();
    const request = httpMock.expectOne({ method: 'POST', url: '/api/quotes/12/decline' });
    expect(request.request.body).toEqual({ note: 'Could it be one cushion instead?' });
    request.flush({ ...sent, status: 'declined', declinedAt: '2026-12-02T10:00:00Z', declineNote: 'Could it be one cushion instead?' });
    await fixture.whenStable();
    expect(page.textContent).toContain('you declined it');
  });

  it('pays the deposit on the hosted card payment page it is given', async () => {
    await open([accepted], owing);
    await (await button(/Pay deposit/)).click();
    httpMock.expectOne({ method: 'POST', url: '/api/quotes/12/deposit-checkout' }).flush({ url: 'http://127.0.0.1:4327/pay/cs_test_1' });
    await fixture.whenStable();
    expect(navigation.goTo).toHaveBeenCalledWith('http://127.0.0.1:4327/pay/cs_test_1');
  });

  it('asks for nothing more while a payment is held for the studio to check, and says so', async () => {
    await open([accepted], { ...owing, items: [{ id: 4, kind: 'deposit', amountPence: 5550, receivedPence: 5000, status: 'held', paidAt: '2026-12-02T10:05:00Z' }] });
    expect(page.querySelector('[data-testid=client-payment-held]')?.textContent).toContain('deposit payment of £50.00 has reached the studio');
    expect(page.textContent).not.toContain('Pay deposit');
  });

  it('says plainly when the card payment service is down, and stays on the page', async () => {
    await open([accepted], owing);
    await (await button(/Pay deposit/)).click();
    httpMock.expectOne('/api/quotes/12/deposit-checkout').flush(
      { error: { code: 'payments_unavailable', message: 'The card payment service is not answering. Nothing was charged; please try again in a few minutes.' } },
      { status: 503, statusText: 'Service Unavailable' },
    );
    await fixture.whenStable();
    expect(navigation.goTo).not.toHaveBeenCalled();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Nothing was charged');
  });

  it('on return from paying, waits for the payment to be confirmed, then says the deposit is paid', async () => {
    const every = PAYMENT_POLL.everyMs;
    PAYMENT_POLL.everyMs = 5;
    try {
      await open([accepted], owing, { payment: 'done' });
      const status = page.querySelector('[data-testid="payment-status"]')!;
      expect(status.getAttribute('aria-live')).toBe('polite');
      expect(status.textContent).toContain('Thank you — your payment is being confirmed');

      await new Promise((r) => setTimeout(r, 20));
      httpMock.expectOne('/api/commissions/5/payments').flush(owing);
      await new Promise((r) => setTimeout(r, 20));
      httpMock.expectOne('/api/commissions/5/payments').flush(depositPaid);
      await fixture.whenStable();
      expect(status.textContent).toContain('Deposit paid');
      expect(page.querySelector('[data-testid="client-due"]')?.textContent).toContain('paid');
      expect(await (await button(/Pay balance/)).getText()).toContain('£129.50');
    } finally {
      PAYMENT_POLL.everyMs = every;
    }
  });

  it('says nothing was charged when the payment was cancelled', async () => {
    await open([accepted], owing, { payment: 'cancelled' });
    expect(page.querySelector('[data-testid="payment-status"]')?.textContent).toContain('Payment cancelled; nothing was charged');
  });
});
