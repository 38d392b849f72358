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

  afterEach(() => httpMock.verify());

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
