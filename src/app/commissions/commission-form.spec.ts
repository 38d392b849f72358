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

  afterEach(() => httpMock.verify());

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
    await type('Deadline', '2027-03-01');
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
