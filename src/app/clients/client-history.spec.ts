import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';

import { ClientHistory } from './client-history';

const record = {
  commissions: [
    { id: 5, title: 'Shirt quilt', stage: 'booked', deadline: '2027-03-01', createdAt: '2026-06-05T10:00:00Z' },
    { id: 3, title: 'Cot quilt', stage: 'enquiry', deadline: null, createdAt: '2026-01-05T10:00:00Z' },
  ],
  quotes: [{ id: 9, commissionId: 5, version: 2, status: 'accepted', totalPence: 42150, sentAt: '2026-11-01T09:00:00Z', acceptedAt: '2026-11-02T09:00:00Z' }],
  payments: [{ id: 11, commissionId: 5, kind: 'deposit', amountPence: 12645, receivedPence: 12645, status: 'paid', method: 'bank_transfer', reference: 'HARTLEY DEP', paidAt: '2026-11-20T12:00:00Z', receiptNumber: 7 }],
};

describe("ClientHistory: a client's commissions, quotes and payments", () => {
  let fixture: ComponentFixture<ClientHistory>;
  let httpMock: HttpTestingController;
  const text = () => (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
  const el = (selector: string) => (fixture.nativeElement as HTMLElement).querySelector(selector);

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [ClientHistory], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ClientHistory);
    fixture.componentRef.setInput('clientId', 4);
    fixture.detectChanges();
  });
  afterEach(() => httpMock?.verify());

  it('lists each commission with a link, the quotes sent and the payments with their receipts', async () => {
    httpMock.expectOne('/api/clients/4/record').flush(record);
    await fixture.whenStable();
    fixture.detectChanges();
    const commissions = el('[data-testid="client-commissions"]')!;
    expect(Array.from(commissions.querySelectorAll('a')).map((a) => [a.textContent, a.getAttribute('href')])).toEqual([
      ['Shirt quilt', '/commissions/5'],
      ['Cot quilt', '/commissions/3'],
    ]);
    expect(el('[data-testid="client-quotes"]')!.textContent!.replace(/\s+/g, ' ')).toContain('Shirt quilt, version 2: £421.50, accepted');
    const payments = el('[data-testid="client-payments"]')!;
    expect(payments.textContent!.replace(/\s+/g, ' ')).toContain('Shirt quilt: deposit £126.45 by bank transfer, paid');
    expect(payments.querySelector('a')!.getAttribute('href')).toBe('/api/commissions/5/payments/11/receipt');
    expect(payments.querySelector('a')!.textContent).toContain('Receipt R-0007');
  });

  it('starts a new commission for this client from its page', async () => {
    httpMock.expectOne('/api/clients/4/record').flush({ commissions: [], quotes: [], payments: [] });
    await fixture.whenStable();
    fixture.detectChanges();
    const link = (el('a[href^="/commissions/new"]') as HTMLAnchorElement).getAttribute('href');
    expect(link).toBe('/commissions/new?client=4');
    expect(text()).toContain('No commissions yet.');
    expect(text()).toContain('No payments yet.');
  });

  it('says when the record could not be loaded and loads it again on Try again', async () => {
    httpMock.expectOne('/api/clients/4/record').flush({ error: { code: 'x', message: 'down' } }, { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();
    fixture.detectChanges();
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    httpMock.expectOne('/api/clients/4/record').flush(record);
    await fixture.whenStable();
    fixture.detectChanges();
    expect(text()).toContain('Shirt quilt');
  });
});
