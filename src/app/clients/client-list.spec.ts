import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import {
  HttpTestingController,
  TestRequest,
  provideHttpClientTesting,
} from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router, provideRouter } from '@angular/router';

import { Role } from '../core/user';
import { signedInAs } from '../../testing/signed-in-as';
import { ClientRow } from './client';
import { LIST_FILTER_DELAY } from '../ui/server-page';
import { ClientList } from './client-list';

const ownerRows: ClientRow[] = [
  { id: 1, name: 'Alder Quince', email: 'alder@example.test', phone: '01632 960 111', createdAt: '2026-03-04T10:00:00Z' },
  { id: 2, name: 'Bryony Tell', email: null, phone: '+44 1632 960222', createdAt: '2026-05-19T09:30:00Z' },
];

describe('ClientList', () => {
  let fixture: ComponentFixture<ClientList>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  async function setUp(role: Role): Promise<void> {
    TestBed.configureTestingModule({
      imports: [ClientList],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs(role),
        { provide: LIST_FILTER_DELAY, useValue: 5 },
      ],
    });
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ClientList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  /** The one pending list request; its query string as a plain object. */
  function expectList(): { request: TestRequest; params: Record<string, string> } {
    const request = httpMock.expectOne((req) => req.url === '/api/clients');
    expect(request.request.method).toBe('GET');
    const params: Record<string, string> = {};
    for (const key of request.request.params.keys()) {
      params[key] = request.request.params.get(key) ?? '';
    }
    return { request, params };
  }

  async function answer(request: TestRequest, items: ClientRow[], total = items.length): Promise<void> {
    request.flush({ items, total });
    await fixture.whenStable();
  }

  async function typeFilter(text: string): Promise<void> {
    const input = await loader.getHarness(MatInputHarness.with({ selector: '[type=search]' }));
    await input.setValue(text);
    // Let the (shortened) debounce pass.
    await new Promise((resolve) => setTimeout(resolve, 50));
    await fixture.whenStable();
  }

  function text(selector: string): string | null {
    const element: HTMLElement | null = fixture.nativeElement.querySelector(selector);
    return element ? (element.textContent ?? '').replace(/\s+/g, ' ').trim() : null;
  }

  afterEach(() => httpMock?.verify());

  it('asks for the first page sorted by name, and shows contact columns to the owner', async () => {
    await setUp('owner');
    const { request, params } = expectList();
    expect(params).toEqual({ page: '0', pageSize: '25', sort: 'name', dir: 'asc' });

    await answer(request, ownerRows, 2);

    const table = await loader.getHarness(MatTableHarness);
    const [headerRow] = await table.getHeaderRows();
    expect(await headerRow.getCellTextByIndex()).toEqual(['Name', 'E-mail', 'Phone', 'Added']);
    const rows = await table.getCellTextByColumnName();
    const page: HTMLElement = fixture.nativeElement;
    expect([...page.querySelectorAll('td.mat-column-name a')].map((a) => a.textContent?.trim())).toEqual(['Alder Quince', 'Bryony Tell']);
    // On a phone, whose screen hides the e-mail column, the address is a second line under the name.
    expect(page.querySelector('td.mat-column-name .ks-phone-line')?.textContent?.trim()).toBe('alder@example.test');
    expect(rows['email'].text).toEqual(['alder@example.test', '']);
    expect(rows['phone'].text).toEqual(['01632 960 111', '+44 1632 960222']);
    expect(rows['createdAt'].text).toEqual(['4 Mar 2026', '19 May 2026']);
    expect(fixture.nativeElement.querySelectorAll('[data-testid=client-row]').length).toBe(2);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add client$/ }))).toHaveSize(1);
    // The owner opens a record from its name.
    const link: HTMLAnchorElement = fixture.nativeElement.querySelector('[data-testid=client-row] a');
    expect(link.getAttribute('href')).toBe('/1');
  });

  it('shows the workroom names only, with no add button', async () => {
    await setUp('workroom');
    const { request } = expectList();
    await answer(request, [{ id: 1, name: 'Alder Quince' }, { id: 2, name: 'Bryony Tell' }]);

    const table = await loader.getHarness(MatTableHarness);
    const [headerRow] = await table.getHeaderRows();
    expect(await headerRow.getCellTextByIndex()).toEqual(['Name']);
    expect((await table.getCellTextByColumnName())['name'].text).toEqual(['Alder Quince', 'Bryony Tell']);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add client$/ }))).toHaveSize(0);
    expect(fixture.nativeElement.querySelector('[data-testid=client-row] a')).toBeNull();

    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    fixture.nativeElement.querySelector('[data-testid=client-row] td').click();
    expect(navigate).not.toHaveBeenCalled();
  });

  it("opens an owner's client from anywhere on its row", async () => {
    await setUp('owner');
    await answer(expectList().request, ownerRows, 2);
    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);

    const cells: NodeListOf<HTMLElement> = fixture.nativeElement.querySelectorAll(
      '[data-testid=client-row]:nth-child(2) td',
    );
    cells[2].click();
    expect(navigate).toHaveBeenCalledTimes(1);
    expect(navigate.calls.mostRecent().args[0]).toEqual([2]);
  });

  it('pages on the server and goes back to the first page when the order changes', async () => {
    await setUp('owner');
    await answer(expectList().request, ownerRows, 60);

    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 25 of 60');
    await paginator.goToNextPage();
    await fixture.whenStable();
    const second = expectList();
    expect(second.params).toEqual({ page: '1', pageSize: '25', sort: 'name', dir: 'asc' });
    await answer(second.request, ownerRows, 60);
    expect(await paginator.getRangeLabel()).toBe('26 – 50 of 60');

    const sort = await loader.getHarness(MatSortHarness);
    const [emailHeader] = await sort.getSortHeaders({ label: 'E-mail' });
    await emailHeader.click();
    await fixture.whenStable();
    const sorted = expectList();
    expect(sorted.params).toEqual({ page: '0', pageSize: '25', sort: 'email', dir: 'asc' });
    await answer(sorted.request, ownerRows, 60);
    expect(await paginator.getRangeLabel()).toBe('1 – 25 of 60');

    await emailHeader.click();
    await fixture.whenStable();
    expect(expectList().params).toEqual({ page: '0', pageSize: '25', sort: 'email', dir: 'desc' });
  });

  it('sends the page size the person picks', async () => {
    await setUp('owner');
    await answer(expectList().request, ownerRows, 60);

    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.setPageSize(50);
    await fixture.whenStable();
    expect(expectList().params).toEqual({ page: '0', pageSize: '50', sort: 'name', dir: 'asc' });
  });

  it('filters on the server, from the first page, after typing stops', async () => {
    await setUp('owner');
    await answer(expectList().request, ownerRows, 60);
    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    await fixture.whenStable();
    await answer(expectList().request, ownerRows, 60);

    await typeFilter('  quince ');

    const filtered = expectList();
    expect(filtered.params).toEqual({ page: '0', pageSize: '25', sort: 'name', dir: 'asc', q: 'quince' });
    await answer(filtered.request, [ownerRows[0]], 1);
    expect(await paginator.getRangeLabel()).toBe('1 – 1 of 1');
  });

  it('invites the owner to add the first client when there are none', async () => {
    await setUp('owner');
    await answer(expectList().request, [], 0);

    expect(text('[data-testid=clients-empty] h2')).toBe('No clients yet');
    expect(text('[role=status]')).toBe('No clients yet.');
    // One add button only: the one in the empty state.
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add client$/ }));
    expect(buttons).toHaveSize(1);
    expect(fixture.nativeElement.querySelector('[data-testid=clients-empty] button')).not.toBeNull();
  });

  it('says when the filter matches nothing, rather than that there are no clients', async () => {
    await setUp('owner');
    await answer(expectList().request, ownerRows, 2);

    await typeFilter('zzz');
    await answer(expectList().request, [], 0);

    expect(text('[data-testid=clients-no-match]')).toBe('No clients match “zzz”.');
    expect(fixture.nativeElement.querySelector('[data-testid=clients-empty]')).toBeNull();
    expect(fixture.nativeElement.querySelectorAll('[data-testid=client-row]').length).toBe(0);
  });

  it('shows a loading bar while waiting, and an error with a retry when loading fails', async () => {
    await setUp('owner');
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).not.toBeNull();
    expect(text('[role=status]')).toBe('Loading clients…');

    expectList().request.flush(
      { error: { code: 'unavailable', message: 'The database is not answering' } },
      { status: 503, statusText: 'Service Unavailable' },
    );
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).toBeNull();
    expect(text('[role=alert] p')).toBe('The clients could not be loaded.');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    await fixture.whenStable();
    await answer(expectList().request, ownerRows, 2);
    expect(fixture.nativeElement.querySelector('[role=alert]')).toBeNull();
    expect(fixture.nativeElement.querySelectorAll('[data-testid=client-row]').length).toBe(2);
  });
});
