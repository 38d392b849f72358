import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Commission } from './commission';
import { LIST_FILTER_DELAY } from '../ui/server-page';
import { CommissionList } from './commission-list';

const late: Commission = {
  id: 1,
  clientId: 4,
  client: { id: 4, name: 'Callum Dewberry' },
  title: 'Two cushions',
  kind: 'cushion',
  recipient: null,
  ageGroup: 'child_under_3',
  occasion: null,
  sizePreset: null,
  widthMm: null,
  lengthMm: null,
  deadline: '2026-11-29',
  daysLeft: -3,
  overdue: true,
  stage: 'booked',
  createdAt: '2026-10-01T09:00:00Z',
};

describe('CommissionList', () => {
  let fixture: ComponentFixture<CommissionList>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  async function create(role: 'owner' | 'workroom' = 'owner'): Promise<void> {
    TestBed.configureTestingModule({
      imports: [CommissionList],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs(role),
        { provide: LIST_FILTER_DELAY, useValue: 0 },
      ],
    });
    fixture = TestBed.createComponent(CommissionList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  function expectList(): TestRequest {
    return httpMock.expectOne((r) => r.url === '/api/commissions');
  }
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  it('asks for the first page by deadline and marks overdue rows in words', async () => {
    await create();
    const first = expectList();
    expect(first.request.params.get('sort')).toBe('deadline');
    expect(first.request.params.get('dir')).toBe('asc');
    expect(first.request.params.get('page')).toBe('0');
    first.flush({ items: [late], total: 1 });
    await fixture.whenStable();
    const row = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="commission-row"]')!;
    expect(row.classList).toContain('overdue');
    expect(row.textContent).toContain('overdue by 3 days');
    expect(row.textContent).toContain('Cushion');
    expect(row.textContent).toContain('Booked');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /New commission/ }))).not.toEqual([]);
  });

  it('sends the stage, text and due-within filters to the server', async () => {
    await create();
    expectList().flush({ items: [late], total: 1 });
    await fixture.whenStable();

    const stages = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Stages' }))).getControl(MatSelectHarness))!;
    await stages.clickOptions({ text: 'Booked' });
    await stages.clickOptions({ text: 'Cutting' });
    await settle();
    const text = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Filter commissions' }))).getControl(MatInputHarness))!;
    await text.setValue('cushion');
    await settle();
    const due = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Due within (days)' }))).getControl(MatInputHarness))!;
    await due.setValue('14');
    await settle();
    const requests = httpMock.match((req) => req.url === '/api/commissions');
    const last = requests[requests.length - 1];
    expect(last.request.params.get('stage')).toBe('booked,cutting');
    expect(last.request.params.get('q')).toBe('cushion');
    expect(last.request.params.get('dueWithinDays')).toBe('14');
    // Earlier requests were given up for newer ones; only the last is still open.
    expect(requests.filter((r) => !r.cancelled)).toEqual([last]);
    last.flush({ items: [], total: 0 });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No commissions match these filters.');
  });

  it('sorts on the server and hides "New commission" from the workroom', async () => {
    await create('workroom');
    expectList().flush({ items: [late], total: 1 });
    await fixture.whenStable();
    const [title] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Title' });
    await title.click();
    const sorted = expectList();
    expect(sorted.request.params.get('sort')).toBe('title');
    sorted.flush({ items: [late], total: 1 });
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /New commission/ }))).toEqual([]);
  });
});
