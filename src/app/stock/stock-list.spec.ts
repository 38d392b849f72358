import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { StockItem } from './stock-item';
import { StockList } from './stock-list';

const calico: StockItem = {
  id: 2,
  name: 'Unbleached calico',
  colour: 'Natural',
  fibre: 'cotton',
  widthMm: '2743.2',
  lengthMm: '6000',
  costPence: 1450,
  costUnit: 'metre',
  supplier: null,
  notes: null,
};

describe('StockList', () => {
  let fixture: ComponentFixture<StockList>;
  let loader: HarnessLoader;
  let root: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [StockList],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    fixture = TestBed.createComponent(StockList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it('says so when the shelves are empty', async () => {
    httpMock.expectOne('/api/stock').flush({ items: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="stock-empty"]')).not.toBeNull();
  });

  it('shows width in both units and the length on hand in metres and yards', async () => {
    httpMock.expectOne('/api/stock').flush({ items: [calico] });
    await fixture.whenStable();
    const row = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="stock-row"]')!;
    expect(row.textContent).toContain('108 in (274.3 cm)');
    expect(row.textContent).toContain('6 m (6 1/2 yd)');
    expect(row.textContent).toContain('£14.50 per metre');
  });

  it('adds a fabric with its lengths as typed, the unit, and the cost in pence', async () => {
    httpMock.expectOne('/api/stock').flush({ items: [] });
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add fabric/ }))).click();
    await fixture.whenStable();
    const input = async (label: string) =>
      (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;
    await (await input('Name')).setValue('Navy quilting cotton');
    await (await input('Width')).setValue('112 cm');
    await (await input('Length on hand')).setValue('3 1/2');
    const unit = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Unit when none is typed' }))).getControl(MatSelectHarness))!;
    await unit.clickOptions({ text: 'yd' });
    await (await input('Cost')).setValue('12.5');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save fabric' }))).click();

    const request = httpMock.expectOne('/api/stock');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      name: 'Navy quilting cotton',
      width: '112 cm',
      length: '3 1/2',
      unit: 'yd',
      costPence: 1250,
      costUnit: 'metre',
    });
    request.flush({ ...calico, id: 3, name: 'Navy quilting cotton' }, { status: 201, statusText: 'Created' });
    httpMock.expectOne('/api/stock').flush({ items: [] });
  });

  it('removes a fabric only after the person confirms', async () => {
    httpMock.expectOne('/api/stock').flush({ items: [calico] });
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove Unbleached calico"]' }))).click();
    const dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep it' }))).click();
    httpMock.expectNone('/api/stock/2');

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove Unbleached calico"]' }))).click();
    await (await (await root.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Remove fabric' }))).click();
    await fixture.whenStable();
    const removal = httpMock.expectOne('/api/stock/2');
    expect(removal.request.method).toBe('DELETE');
    removal.flush(null, { status: 204, statusText: 'No Content' });
    httpMock.expectOne('/api/stock').flush({ items: [] });
  });
});

describe('StockList for the workroom', () => {
  let fixture: ComponentFixture<StockList>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [StockList],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('workroom'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(StockList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it('lists the fabric to read, without cost, supplier or any way to change it', async () => {
    // The server leaves the cost fields out for the workroom.
    const { costPence: _c, costUnit: _u, supplier: _s, ...withoutCost } = calico;
    httpMock.expectOne('/api/stock').flush({ items: [{ ...withoutCost, notes: 'Backing only' }] });
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    const row = page.querySelector('[data-testid="stock-row"]')!;
    expect(row.textContent).toContain('Unbleached calico');
    expect(row.textContent).toContain('108 in (274.3 cm)');
    expect(row.textContent).toContain('Backing only');
    const headers = Array.from(page.querySelectorAll('th')).map((th) => th.textContent?.trim());
    expect(headers).not.toContain('Cost');
    expect(headers).not.toContain('Supplier');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add fabric/ }))).toEqual([]);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ selector: '[aria-label^="Change"], [aria-label^="Remove"]' }))).toEqual([]);
  });

  it('says plainly when there is nothing on the list, without asking them to add any', async () => {
    httpMock.expectOne('/api/stock').flush({ items: [] });
    await fixture.whenStable();
    const empty = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="stock-empty"]');
    expect(empty?.textContent).toContain('No studio fabric on the list yet.');
    expect(empty?.textContent).not.toContain('Add the backing');
  });
});
