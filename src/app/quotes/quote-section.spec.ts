import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';

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

  afterEach(() => httpMock.verify());

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
