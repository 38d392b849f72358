import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

import { Quote } from './quote';
import { QuoteEditor } from './quote-editor';

/** A draft as the server sends it: VAT registered at 20%, worked per line, 30% deposit. */
const draft: Quote = {
  id: 41,
  commissionId: 3,
  version: 2,
  status: 'draft',
  intro: 'Thank you for the dresses.',
  validUntil: null,
  expired: false,
  depositPercent: 30,
  vatRate: '20',
  vatMode: 'line',
  lines: [
    { id: 1, position: 0, kind: 'labour', description: 'Piecing two cushion covers', quantity: '6.5', unit: 'hours', unitPricePence: 2800, stage: 'piecing', netPence: 18200, vatPence: 3640 },
    { id: 2, position: 1, kind: 'material', description: 'Fusible interfacing', quantity: '2.6', unit: 'm', unitPricePence: 1450, stage: null, netPence: 3770, vatPence: 754 },
  ],
  totals: { netPence: 21970, vatPence: 4394, totalPence: 26364, depositPence: 7909, balancePence: 18455 },
  sentAt: null,
  acceptedAt: null,
  acceptedName: null,
  declinedAt: null,
  declineNote: null,
  createdAt: '2026-12-01T10:00:00Z',
};

/** What the design's pricing says of commission 3: two notes, and piecing learned from seven finished commissions. */
const suggestion = {
  designVersion: 1,
  lines: [],
  notes: ['Not priced: thread, a sewn-in label. The studio keeps no cost for them; add a line if you charge for them.'],
  learned: [{ stage: 'piecing', ratio: '1.18', commissions: 7, blockKind: null, basis: 'from 7 finished commissions: logged 1.18\u00d7 quoted for piecing' }],
};

describe('QuoteEditor', () => {
  let fixture: ComponentFixture<QuoteEditor>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [QuoteEditor],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    fixture = TestBed.createComponent(QuoteEditor);
    fixture.componentRef.setInput('quote', draft);
    fixture.componentRef.setInput('hourlyRatePence', 2800);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/3/quote-suggestion').flush(suggestion);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = async (label: string) => (await (await field(label)).getControl(MatInputHarness))!;
  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  const shown = (testId: string) => page.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim();

  async function addDiscount(price: string): Promise<void> {
    await (await button(/Add discount/)).click();
    await (await input('Description of line 3')).setValue('Returning client');
    await (await input('Price each (£) of line 3')).setValue(price);
    await (await input('Price each (£) of line 3')).blur();
    await fixture.whenStable();
  }

  it('works out the totals as lines change: per-line VAT, deposit and balance, checked by hand', async () => {
    // Hand-worked: 6.5 h x £28.00 = £182.00; 2.6 m x £14.50 = £37.70; discount 1 x -£10.00.
    // VAT per line at 20%: £36.40 + £7.54 - £2.00 = £41.94. Subtotal £209.70, total £251.64.
    // Deposit 30% of £251.64 = £75.492, rounded to £75.49; balance £176.15.
    expect(shown('total-total')).toBe('£263.64');
    await addDiscount('-10.00');

    expect(shown('total-net')).toBe('£209.70');
    expect(shown('total-vat')).toBe('£41.94');
    expect(shown('total-total')).toBe('£251.64');
    expect(shown('total-deposit')).toBe('£75.49');
    expect(shown('total-balance')).toBe('£176.15');
    expect(page.querySelector('.live-totals')?.getAttribute('aria-live')).toBe('polite');
    const amounts = Array.from(page.querySelectorAll('[data-testid="line-amount"]')).map((el) => el.textContent?.replace(/.*:\s*/, '').trim());
    expect(amounts).toEqual(['£182.00', '£37.70', '-£10.00']);
  });

  it('sends prices as whole pence and quantities as typed when the quote is saved', async () => {
    await (await input('Price each (£) of line 2')).setValue('14.55');
    await addDiscount('-10');
    await (await button('Save quote')).click();

    const request = httpMock.expectOne({ method: 'PUT', url: '/api/quotes/41' });
    expect(request.request.body).toEqual({
      intro: 'Thank you for the dresses.',
      depositPercent: 30,
      lines: [
        { kind: 'labour', description: 'Piecing two cushion covers', quantity: '6.5', unit: 'hours', unitPricePence: 2800, stage: 'piecing' },
        { kind: 'material', description: 'Fusible interfacing', quantity: '2.6', unit: 'm', unitPricePence: 1455 },
        { kind: 'discount', description: 'Returning client', quantity: '1', unit: 'item', unitPricePence: -1000 },
      ],
    });
    request.flush({ ...draft });
  });

  it('refuses a discount that is not negative, and a negative price on any other line', async () => {
    await addDiscount('10.00');
    expect(await (await field('Price each (£) of line 3')).getTextErrors()).toEqual(['A discount is a negative amount, like -10.00']);
    await (await input('Price each (£) of line 1')).setValue('-28');
    await (await input('Price each (£) of line 1')).blur();
    expect(await (await field('Price each (£) of line 1')).getTextErrors()).toEqual(['Only a discount can be negative']);

    await (await button('Save quote')).click();
    httpMock.expectNone({ method: 'PUT' });
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Some lines need a change');
  });

  it('asks before sending, saying the client is e-mailed and the version frozen', async () => {
    const sent = jasmine.createSpy('sent');
    fixture.componentInstance.sent.subscribe(sent);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);

    await (await button(/Send quote/)).click();
    let dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Send version 2 to the client?');
    expect(await dialog.getContentText()).toContain('e-mailed');
    expect(await dialog.getContentText()).toContain('frozen');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep editing' }))).click();
    await fixture.whenStable();
    httpMock.expectNone('/api/quotes/41/send');

    await (await button(/Send quote/)).click();
    dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Send quote' }))).click();
    await fixture.whenStable();
    httpMock.expectOne({ method: 'POST', url: '/api/quotes/41/send' }).flush({ ...draft, status: 'sent', sentAt: '2026-12-02T09:00:00Z', validUntil: '2027-01-01' });
    await fixture.whenStable();
    expect(sent).toHaveBeenCalledWith(jasmine.objectContaining({ id: 41, status: 'sent' }));
  });

  it("shows the server's reason when sending is refused", async () => {
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await (await button(/Send quote/)).click();
    await (await (await root.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Send quote' }))).click();
    await fixture.whenStable();
    httpMock.expectOne('/api/quotes/41/send').flush(
      { error: { code: 'no_email', message: 'Add an e-mail address for Callum Dewberry before sending the quote.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Add an e-mail address for Callum Dewberry');
  });

  it('shows the learned labour estimate with its basis on the piecing line, and takes it with a click', async () => {
    const learned = () => Array.from(page.querySelectorAll('[data-testid="learned"]')).map((el) => el.textContent?.replace(/\s+/g, ' ').trim());
    // Hand-worked: 6.5 h x 1.18 = 7.67 h, up to the quarter: 7.75 h. The material line has no stage: nothing learned.
    expect(learned()).toEqual(['lightbulbSuggested 7.75 h, from 7 finished commissions: logged 1.18\u00d7 quoted for piecing. Use 7.75 h for line 1']);
    expect(shown('suggestion-notes')).toContain('Not priced: thread, a sewn-in label.');

    await (await button('Use 7.75 h for line 1')).click();
    await fixture.whenStable();
    expect(await (await input('Quantity of line 1')).getValue()).toBe('7.75');
    // 7.75 h x £28.00 = £217.00.
    expect(page.querySelector('[data-testid="line-amount"]')?.textContent).toContain('£217.00');
    expect(learned()[0]).toContain('Learned estimate in use: 7.75 h');

    await (await button('Save quote')).click();
    const request = httpMock.expectOne({ method: 'PUT', url: '/api/quotes/41' });
    expect(request.request.body.lines[0]).toEqual({ kind: 'labour', description: 'Piecing two cushion covers', quantity: '7.75', unit: 'hours', unitPricePence: 2800, stage: 'piecing' });
    request.flush({ ...draft });
  });
});
