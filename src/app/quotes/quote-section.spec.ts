import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';

import { Notices } from '../core/notices';
import { QuoteSection } from './quote-section';

const settings = {
  id: 1,
  studioName: 'Studio',
  makerName: 'Maker',
  address: '',
  email: null,
  hourlyRatePence: 3000,
  vatRegistered: false,
  vatRate: '20',
  vatMode: 'line',
  vatNumber: null,
  depositPercent: '30.00',
  validityDays: 30,
  paymentTerms: '',
  blockMinutes: {},
  remindQuoteExpiry: true,
  remindBalanceDue: true,
  remindGarmentsLate: true,
  garmentsLateDays: 14,
  calendarFeedMadeAt: null,
  locale: 'en-GB',
  updatedAt: '2026-12-01T10:00:00Z',
};

describe('QuoteSection: a new quote priced from the design', () => {
  let fixture: ComponentFixture<QuoteSection>;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [QuoteSection],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) }],
    });
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(QuoteSection);
    fixture.componentRef.setInput('commissionId', 7);
    fixture.componentRef.setInput('stage', 'enquiry');
    fixture.detectChanges();
    httpMock.expectOne('/api/commissions/7/quotes').flush({ items: [] });
    httpMock.expectOne('/api/commissions/7/payments').flush({ items: [], due: null });
    httpMock.expectOne('/api/settings').flush(settings);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const newQuote = async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /^add\s*New quote$/ }))).click();
  };

  it('starts the first draft from the lines the design is priced at', async () => {
    await newQuote();
    const lines = [
      { kind: 'labour', description: 'Piecing 20 blocks and the top', quantity: '2.00', unit: 'hours', unitPricePence: 3000, stage: 'piecing' },
      { kind: 'material', description: 'Navy cotton (binding)', quantity: '0.5', unit: 'm', unitPricePence: 1200 },
    ];
    httpMock.expectOne('/api/commissions/7/quote-suggestion').flush({ designVersion: 2, lines });
    const create = httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/quotes' });
    expect(create.request.body).toEqual({ lines, depositPercent: 30 });
  });

  it('falls back to one labour line at the hourly rate when there is no design', async () => {
    await newQuote();
    httpMock.expectOne('/api/commissions/7/quote-suggestion').flush({ designVersion: null, lines: [] });
    const create = httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/quotes' });
    expect(create.request.body.lines).toEqual([{ kind: 'labour', description: 'Making: piecing, quilting and binding', quantity: '1', unit: 'hours', unitPricePence: 3000 }]);
  });
});

describe('QuoteSection: payments that need the owner', () => {
  let fixture: ComponentFixture<QuoteSection>;
  let httpMock: HttpTestingController;
  let notices: jasmine.SpyObj<Notices>;
  const held = { id: 31, kind: 'deposit', amountPence: 12645, receivedPence: 10000, status: 'held', refundReason: null, paidAt: '2026-12-04T10:00:00Z', refundedAt: null };
  const paid = { id: 30, kind: 'deposit', amountPence: 12645, receivedPence: 12645, status: 'paid', refundReason: null, paidAt: '2026-12-04T09:00:00Z', refundedAt: null };
  const overpaid = { id: 32, kind: 'deposit', amountPence: 12645, receivedPence: 12645, status: 'overpaid', refundReason: null, paidAt: '2026-12-04T09:05:00Z', refundedAt: null };
  const due = { depositPence: 12645, depositPaid: false, balancePence: 42150, balancePaid: false, quoteId: 3 };

  async function open(items: object[], dueNow: object = due): Promise<void> {
    TestBed.configureTestingModule({
      imports: [QuoteSection],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    httpMock = TestBed.inject(HttpTestingController);
    notices = TestBed.inject(Notices) as jasmine.SpyObj<Notices>;
    fixture = TestBed.createComponent(QuoteSection);
    fixture.componentRef.setInput('commissionId', 7);
    fixture.componentRef.setInput('stage', 'quoted');
    fixture.detectChanges();
    flushLoad(items, dueNow);
    await fixture.whenStable();
  }

  function flushLoad(items: object[], dueNow: object = due): void {
    httpMock.expectOne('/api/commissions/7/quotes').flush({ items: [] });
    httpMock.expectOne('/api/commissions/7/payments').flush({ items, due: dueNow });
    httpMock.expectOne('/api/settings').flush(settings);
  }

  afterEach(() => httpMock?.verify());

  const text = (testId: string) => Array.from(fixture.nativeElement.querySelectorAll(`[data-testid="${testId}"]`) as NodeListOf<HTMLElement>).map((e) => e.textContent!.replace(/\s+/g, ' ').trim());

  /** Each payment row as its cells' text: payment, amount, status (the date is left out). */
  const rows = () =>
    Array.from(fixture.nativeElement.querySelectorAll('[data-testid="payment-row"]') as NodeListOf<HTMLElement>).map((r) =>
      Array.from(r.querySelectorAll('td')).slice(0, 3).map((c) => c.textContent!.replace(/\s+/g, ' ').trim()),
    );

  async function confirm(label: string): Promise<MatDialogHarness> {
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: label }))).click();
    return dialog;
  }

  it('says what was paid and what was asked for a held payment, and counts it once the owner accepts', async () => {
    await open([held]);
    const changed = jasmine.createSpy('changed');
    fixture.componentInstance.changed.subscribe(changed);
    expect(text('payment-review')).toEqual([
      jasmine.stringContaining('Deposit held for your review. The client paid £100.00 by card, but £126.45 was asked, so it does not count yet and the commission is not booked.'),
    ]);
    expect(rows()).toEqual([['Deposit', '£100.00 (£126.45 asked)', 'Held for checking']]);

    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Accept £100.00' }))).click();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Accept £100.00 as the deposit?');
    // 421.50 still owed - 100.00 accepted = 321.50.
    expect(await dialog.getContentText()).toBe('It counts from now: the commission is booked and the client gets a receipt for £100.00, and the balance becomes £321.50.');
    await confirm('Accept £100.00');
    httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/payments/31/accept' }).flush({ ...held, status: 'paid' });
    flushLoad([{ ...held, status: 'paid' }], { ...due, depositPaid: true, balancePence: 32150 });
    await fixture.whenStable();
    expect(notices.info).toHaveBeenCalledWith('£100.00 is accepted as the deposit.');
    expect(changed).toHaveBeenCalled();
    expect(text('payment-review')).toEqual([]);
  });

  it('refunds a held payment only after asking, and sends nothing when the owner keeps it', async () => {
    await open([held]);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Refund £100.00' }))).click();
    await confirm('Keep it');
    httpMock.expectNone('/api/commissions/7/payments/31/refund');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Refund £100.00' }))).click();
    await confirm('Refund £100.00');
    httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/payments/31/refund' }).flush({ ...held, status: 'refunded', refundReason: 'amount_mismatch' });
    flushLoad([{ ...held, status: 'refunded', refundReason: 'amount_mismatch', refundedAt: '2026-12-04T11:00:00Z' }]);
    await fixture.whenStable();
    expect(rows()).toEqual([['Deposit', '£100.00 (£126.45 asked)', 'Refunded (not the amount asked)']]);
  });

  it("shows a second payment whose refund did not go through, and the service's message when it fails again", async () => {
    await open([paid, overpaid], { ...due, depositPaid: true, balancePence: 29505 });
    expect(text('payment-review')).toEqual([jasmine.stringContaining('Deposit paid twice. A second payment of £126.45 arrived for a deposit that was already paid.')]);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /^Accept/ }))).toEqual([]);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Refund £126.45' }))).click();
    await confirm('Refund £126.45');
    const message = 'The card payment service did not accept the refund just now. Nothing changed; try again shortly.';
    httpMock.expectOne('/api/commissions/7/payments/32/refund').flush({ error: { code: 'payments_unavailable', message } }, { status: 503, statusText: 'Service Unavailable' });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="alert"]').textContent).toContain(message);
    expect(text('payment-review')).toHaveSize(1);
  });

  it('names why a refunded payment went back', async () => {
    await open([paid, { ...overpaid, status: 'refunded', refundReason: 'overpaid', refundedAt: '2026-12-04T09:06:00Z' }], { ...due, depositPaid: true, balancePence: 29505 });
    expect(text('payment-review')).toEqual([]);
    expect(rows()).toEqual([
      ['Deposit', '£126.45', 'Paid'],
      ['Deposit', '£126.45', 'Refunded (paid twice)'],
    ]);
  });

  it('records a cash deposit from the form, then lists it with its method, reference and receipt', async () => {
    await open([]);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Record a cash or bank-transfer payment' }))).click();
    const reference = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('ks-record-payment-form input[formcontrolname="reference"]')!;
    reference.value = 'Cash at the fitting';
    reference.dispatchEvent(new Event('input'));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Record payment' }))).click();
    const req = httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/payments/manual' });
    expect(req.request.body).toEqual(jasmine.objectContaining({ kind: 'deposit', amountPence: 12645, method: 'cash', reference: 'Cash at the fitting' }));
    const cash = { ...paid, id: 40, method: 'cash', reference: 'Cash at the fitting', receivedOn: '2026-12-04', receiptNumber: 12 };
    req.flush(cash, { status: 201, statusText: 'Created' });
    httpMock.expectOne('/api/commissions/7/payments').flush({ items: [cash], due: { ...due, depositPaid: true, balancePence: 29505 } });
    await fixture.whenStable();
    expect(notices.info).toHaveBeenCalledWith('Deposit of £126.45 recorded; the client has been sent a receipt.');
    const cells = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="payment-row"] td')).map((c) => c.textContent!.replace(/\s+/g, ' ').trim());
    expect(cells[3]).toBe('Cash (Cash at the fitting)');
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="payment-row"] a')!.getAttribute('href')).toBe('/api/commissions/7/payments/40/receipt');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Record a cash or bank-transfer payment' }))).isDisabled()).toBeFalse();
  });

  it('undoes a payment recorded by hand only with a note saying why', async () => {
    const cash = { ...paid, id: 40, method: 'cash', reference: 'Cash at the fitting', receiptNumber: 12 };
    await open([cash], { ...due, depositPaid: true, balancePence: 29505 });
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Undo…' }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Undo payment' }))).click();
    httpMock.expectNone('/api/commissions/7/payments/40/undo');
    expect(text('undo-payment')[0]).toContain('Say why this payment is undone');
    const note = (fixture.nativeElement as HTMLElement).querySelector<HTMLTextAreaElement>('[data-testid="undo-payment"] textarea')!;
    note.value = 'Recorded on the wrong commission';
    note.dispatchEvent(new Event('input'));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Undo payment' }))).click();
    const req = httpMock.expectOne({ method: 'POST', url: '/api/commissions/7/payments/40/undo' });
    expect(req.request.body).toEqual({ note: 'Recorded on the wrong commission' });
    req.flush({ ...cash, status: 'undone' });
    httpMock.expectOne('/api/commissions/7/payments').flush({ items: [{ ...cash, status: 'undone' }], due });
    await fixture.whenStable();
    expect(rows()).toEqual([['Deposit', '£126.45', 'Undone by the studio']]);
    expect(text('undo-payment')).toEqual([]);
  });
});
