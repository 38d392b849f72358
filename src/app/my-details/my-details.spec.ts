import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';

import { Client } from '../clients/client';
import { MyDetails } from './my-details';

const me: Client = {
  id: 11,
  name: 'Cass Penrose',
  email: 'cass@example.test',
  phone: null,
  address: '4 Loom Lane\nWeftbury',
  notes: null,
  portfolioConsent: false,
  createdAt: '2026-10-01T09:00:00Z',
  updatedAt: '2026-10-01T09:00:00Z',
};

describe('MyDetails', () => {
  let fixture: ComponentFixture<MyDetails>;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  const ownRequest = () => httpMock.expectOne((r) => r.url === '/api/clients' && r.params.get('pageSize') === '1');

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [MyDetails],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    fixture = TestBed.createComponent(MyDetails);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it('shows what the studio holds, saying what is not given', async () => {
    expect(page.querySelector('mat-progress-bar')?.getAttribute('aria-label')).toBe('Loading your details');
    ownRequest().flush({ items: [me], total: 1 });
    await fixture.whenStable();
    const card = page.querySelector('[data-testid="my-details-card"]')?.textContent ?? '';
    expect(card).toContain('Cass Penrose');
    expect(card).toContain('cass@example.test');
    expect(card).toContain('Not given'); // the phone
    expect(card).toContain('No photos of your piece will appear');
    expect(page.querySelector('mat-progress-bar')).toBeNull();
  });

  it('says when the sign-in has no client record', async () => {
    ownRequest().flush({ items: [], total: 0 });
    await fixture.whenStable();
    expect(page.textContent).toContain('not linked to a client record yet');
  });

  it('says when the details could not be loaded, and loads them on Try again', async () => {
    ownRequest().flush({ message: 'down' }, { status: 503, statusText: 'Service Unavailable' });
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Your details could not be loaded.');

    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    ownRequest().flush({ items: [me], total: 1 });
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')).toBeNull();
    expect(page.querySelector('[data-testid="my-details-card"]')?.textContent).toContain('Cass Penrose');
  });
});
