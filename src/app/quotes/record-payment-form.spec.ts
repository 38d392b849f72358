import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import { Payment } from './quote';
import { RecordPaymentForm } from './record-payment-form';

describe('RecordPaymentForm: the owner records cash or a bank transfer', () => {
  let fixture: ComponentFixture<RecordPaymentForm>;
  let httpMock: HttpTestingController;
  let loader: HarnessLoader;
  let recorded: Payment[];

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: new RegExp(`^${label.replace(/[()£]/g, '.')}`) }));
  const input = async (label: string) => (await (await field(label)).getControl(MatInputHarness))!;
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Record payment' }))).click();

  function create(due: { depositPence: number; balancePence: number; depositPaid: boolean } | null) {
    fixture = TestBed.createComponent(RecordPaymentForm);
    fixture.componentRef.setInput('commissionId', 7);
    fixture.componentRef.setInput('due', due);
    recorded = [];
    fixture.componentInstance.recorded.subscribe((p) => recorded.push(p));
    fixture.detectChanges();
    loader = TestbedHarnessEnvironment.loader(fixture);
  }

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [RecordPaymentForm],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    httpMock = TestBed.inject(HttpTestingController);
  });
  afterEach(() => httpMock?.verify());

  it('suggests the deposit due, then sends the payment in pence with its method, day and reference', async () => {
    create({ depositPence: 12645, balancePence: 29505, depositPaid: false });
    expect(await (await input('Amount received')).getValue()).toBe('126.45');
    await (await (await field('How it was paid')).getControl(MatSelectHarness))!.clickOptions({ text: 'Bank transfer' });
    await (await input('Date received')).setValue('2026-11-20');
    await (await input('Reference')).setValue('  HARTLEY DEP ');
    await submit();
    const req = httpMock.expectOne('/api/commissions/7/payments/manual');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ kind: 'deposit', amountPence: 12645, method: 'bank_transfer', receivedOn: '2026-11-20', reference: 'HARTLEY DEP' });
    req.flush({ id: 3, kind: 'deposit', amountPence: 12645, receivedPence: 12645, status: 'paid', refundReason: null, paidAt: '2026-11-20T12:00:00Z', refundedAt: null, method: 'bank_transfer', reference: 'HARTLEY DEP', receivedOn: '2026-11-20', receiptNumber: 4 });
    await fixture.whenStable();
    expect(recorded.map((p) => p.receiptNumber)).toEqual([4]);
  });

  it('offers the balance once the deposit is paid', async () => {
    create({ depositPence: 12645, balancePence: 29505, depositPaid: true });
    expect(await (await (await field('Payment')).getControl(MatSelectHarness))!.getValueText()).toBe('Balance');
    expect(await (await input('Amount received')).getValue()).toBe('295.05');
  });

  it('says what to fix, and sends nothing, for a missing reference, a bad amount or a day ahead', async () => {
    create(null);
    await (await input('Amount received')).setValue('12.345');
    await (await input('Date received')).setValue('2999-01-01');
    await submit();
    httpMock.expectNone('/api/commissions/7/payments/manual');
    expect(await (await field('Amount received (£)')).getTextErrors()).toEqual(['Enter pounds and pence, such as 126.45']);
    expect(await (await field('Date received')).getTextErrors()).toEqual(['The day cannot be in the future']);
    expect(await (await field('Reference')).getTextErrors()).toEqual(['Enter a reference']);
    await (await input('Amount received')).setValue('0');
    expect(await (await field('Amount received (£)')).getTextErrors()).toEqual(['The amount must be more than £0.00']);
  });

  it('shows the server refusing a kind already paid, keeping what was typed', async () => {
    create({ depositPence: 12645, balancePence: 29505, depositPaid: false });
    await (await input('Reference')).setValue('Cash at the fitting');
    await submit();
    httpMock
      .expectOne('/api/commissions/7/payments/manual')
      .flush({ error: { code: 'already_paid', message: 'The deposit has already been paid (£126.45, receipt R-0004).', fields: { kind: 'The deposit is already paid.', amountPence: 'At most £295.05 is owed.' } } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('The deposit has already been paid (£126.45, receipt R-0004).');
    expect(await (await field('Amount received (£)')).getTextErrors()).toEqual(['At most £295.05 is owed.']);
    expect(await (await input('Reference')).getValue()).toBe('Cash at the fitting');
    expect(recorded).toEqual([]);
  });
});
