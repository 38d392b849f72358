import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import { Notices } from '../core/notices';
import { Panel } from './commission';
import { PanelsEditor } from './panels-editor';

describe('PanelsEditor', () => {
  let fixture: ComponentFixture<PanelsEditor>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  async function create(panels: Panel[] = []): Promise<void> {
    TestBed.configureTestingModule({
      imports: [PanelsEditor],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(PanelsEditor);
    fixture.componentRef.setInput('garmentId', 12);
    fixture.componentRef.setInput('panels', panels);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  }

  afterEach(() => httpMock.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));

  async function typeInto(label: string, text: string): Promise<void> {
    const formField = await field(label);
    const control = (await formField.getControl(MatInputHarness))!;
    await control.setValue(text);
    await fixture.whenStable();
  }

  async function addRow(): Promise<void> {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add panel/ }))).click();
    await fixture.whenStable();
  }

  it('says so when no panels are measured yet', async () => {
    await create();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="panels-empty"]')).not.toBeNull();
  });

  it('reads a fraction as it is typed and shows it in inches and centimetres', async () => {
    await create();
    await addRow();
    await typeInto('Width', '19 1/2');
    expect(await (await field('Width')).getTextHints()).toEqual(['19 1/2 in · 49.5 cm']);

    await typeInto('Height', '7½');
    expect(await (await field('Height')).getTextHints()).toEqual(['7 1/2 in · 19.1 cm']);

    await typeInto('Height', '50 cm');
    expect(await (await field('Height')).getTextHints()).toEqual(['19 5/8 in · 50 cm']);

    // The reading sits under the field, not inside the input's box.
    const readings = (fixture.nativeElement as HTMLElement).querySelectorAll(
      '.mat-mdc-form-field-subscript-wrapper [data-testid="length-reading"]',
    );
    expect(readings.length).toBe(2);
  });

  it("shows the parser's own message for a length it cannot read", async () => {
    await create();
    await addRow();
    await typeInto('Width', '19,5');
    const width = await field('Width');
    expect(await width.isControlValid()).toBeFalse();
    const [message] = await width.getTextErrors();
    expect(message).toContain('Use a point for decimals (7.5, not 7,5).');
    expect(message).toContain('got "19,5"');
    expect(await width.getTextHints()).toEqual([]);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
    httpMock.expectNone('/api/garments/12/panels');
  });

  it('saves a new row with the lengths as typed and the chosen unit', async () => {
    await create();
    await addRow();
    await typeInto('Name', 'back');
    const unit = await loader.getHarness(MatSelectHarness.with({ selector: '.unit mat-select' }));
    await unit.clickOptions({ text: 'centimetres' });
    await typeInto('Width', '49 1/2');
    await typeInto('Height', '610mm');
    expect(await (await field('Width')).getTextHints()).toEqual(['19 1/2 in · 49.5 cm']);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
    const request = httpMock.expectOne('/api/garments/12/panels');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ name: 'back', width: '49 1/2', height: '610mm', unit: 'cm', grain: 'vertical' });
    request.flush({ id: 5, name: 'back', widthMm: '495', heightMm: '610', grain: 'vertical' }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Saved: 19 1/2 in (49.5 cm) × 24 in (61 cm)');
  });

  it('edits a saved panel by sending only what changed, and deletes it', async () => {
    await create([{ id: 8, name: 'left front', widthMm: '254', heightMm: '508', grain: 'vertical' }]);
    expect(await (await (await field('Width')).getControl(MatInputHarness))!.getValue()).toBe('10 in');
    await typeInto('Height', '21');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
    const edit = httpMock.expectOne('/api/panels/8');
    expect(edit.request.method).toBe('PATCH');
    expect(edit.request.body).toEqual({ height: '21', unit: 'in' });
    edit.flush({ id: 8, name: 'left front', widthMm: '254', heightMm: '533.4', grain: 'vertical' });
    await fixture.whenStable();

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Delete panel left front"]' }))).click();
    const removal = httpMock.expectOne('/api/panels/8');
    expect(removal.request.method).toBe('DELETE');
    removal.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="panel-row"]').length).toBe(0);
  });

  it("puts the server's field message under the field it concerns", async () => {
    await create();
    await addRow();
    await typeInto('Name', 'sleeve');
    await typeInto('Width', '400 in');
    await typeInto('Height', '20');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
    httpMock.expectOne('/api/garments/12/panels').flush(
      { error: { code: 'validation', message: 'Check the panel', fields: { width: 'Wider than any garment panel.' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await (await field('Width')).getTextErrors()).toEqual(['Wider than any garment panel.']);
  });
});
