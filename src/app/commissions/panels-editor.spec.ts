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

  afterEach(() => httpMock?.verify());

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

  describe('kept features', () => {
    const pocket = { name: 'breast pocket', xMm: '50.8', yMm: '101.6', widthMm: '127', heightMm: '139.7' };
    const front: Panel = { id: 8, name: 'left front', widthMm: '254', heightMm: '596.9', grain: 'vertical', features: [pocket] };
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    const featureRows = () => (fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="feature-row"]');
    const inputValue = async (label: string) => (await (await field(label)).getControl(MatInputHarness))!.getValue();

    it("lists a panel's kept features with their lengths in both units", async () => {
      await create([front]);
      expect(featureRows().length).toBe(1);
      expect(await inputValue('Feature')).toBe('breast pocket');
      expect(await inputValue('From left')).toBe('2 in');
      expect(await (await field('From top')).getTextHints()).toEqual(['4 in · 10.2 cm']);
      expect(await (await field('Feature height')).getTextHints()).toEqual(['5 1/2 in · 14 cm']);
      expect(text()).toContain('Kept whole: breast pocket, 5 in (12.7 cm) × 5 1/2 in (14 cm), 2 in (5.1 cm) from the left, 4 in (10.2 cm) from the top');
    });

    it('adds a kept feature to a new panel and saves it with the panel, lengths as typed', async () => {
      await create();
      await addRow();
      expect(text()).toContain('None. A pocket, label or embroidery to keep whole');
      await typeInto('Name', 'left front');
      await typeInto('Width', '10');
      await typeInto('Height', '23 1/2');
      await (await loader.getHarness(MatButtonHarness.with({ text: /Add kept feature/ }))).click();
      await fixture.whenStable();
      await typeInto('Feature', 'breast pocket');
      await typeInto('From left', '0');
      await typeInto('From top', '10 cm');
      await typeInto('Feature width', '5');
      await typeInto('Feature height', '5½');
      // Zero is a distance from the edge; the reading shows both units.
      expect(await (await field('From left')).isControlValid()).toBeTrue();
      expect(await (await field('From top')).getTextHints()).toEqual(['3 7/8 in · 10 cm']);
      expect(await (await field('Feature height')).getTextHints()).toEqual(['5 1/2 in · 14 cm']);

      await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
      const request = httpMock.expectOne('/api/garments/12/panels');
      expect(request.request.body).toEqual({
        name: 'left front',
        width: '10',
        height: '23 1/2',
        unit: 'in',
        grain: 'vertical',
        features: [{ name: 'breast pocket', x: '0', y: '10 cm', width: '5', height: '5½' }],
      });
      request.flush({ ...front, features: [{ ...pocket, xMm: '0', yMm: '100' }] }, { status: 201, statusText: 'Created' });
      await fixture.whenStable();
      expect(text()).toContain('Kept whole: breast pocket, 5 in (12.7 cm) × 5 1/2 in (14 cm), 0 in (0 cm) from the left, 3 7/8 in (10 cm) from the top');
    });

    it('does not save a feature with a length it cannot read', async () => {
      await create([front]);
      await typeInto('Feature width', '0');
      const [message] = await (await field('Feature width')).getTextErrors();
      expect(message).toContain('A length must be greater than 0.');
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
      httpMock.expectNone('/api/panels/8');
    });

    it('sends the whole list on an edit, untouched lengths as their exact millimetres', async () => {
      await create([front]);
      await typeInto('From top', '4 1/2');
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
      const edit = httpMock.expectOne('/api/panels/8');
      expect(edit.request.method).toBe('PATCH');
      expect(edit.request.body).toEqual({
        features: [{ name: 'breast pocket', x: '50.8mm', y: '4 1/2', width: '127mm', height: '139.7mm' }],
        unit: 'in',
      });
      edit.flush({ ...front, features: [{ ...pocket, yMm: '114.3' }] });
      await fixture.whenStable();
      expect(text()).toContain('4 1/2 in (11.4 cm) from the top');
    });

    it('removes a kept feature when the panel is saved', async () => {
      await create([front]);
      await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove kept feature breast pocket"]' }))).click();
      await fixture.whenStable();
      expect(featureRows().length).toBe(0);
      expect(text()).toContain('Changed, not saved yet');
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
      const edit = httpMock.expectOne('/api/panels/8');
      expect(edit.request.body).toEqual({ features: [], unit: 'in' });
      edit.flush({ ...front, features: [] });
      await fixture.whenStable();
      expect(text()).not.toContain('Kept whole');
    });

    it("puts the server's message for a feature outside the panel under that feature's field", async () => {
      await create([front]);
      await typeInto('From left', '6');
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Save panel' }))).click();
      const message = "The breast pocket runs past the panel's right edge: it ends 11 in (27.9 cm) from the left, and the panel is 10 in (25.4 cm) wide.";
      httpMock.expectOne('/api/panels/8').flush(
        { error: { code: 'validation', message: 'A kept feature would lie outside the panel.', fields: { 'features.0.width': message } } },
        { status: 400, statusText: 'Bad Request' },
      );
      await fixture.whenStable();
      expect(await (await field('Feature width')).getTextErrors()).toEqual([message]);
    });
  });
});
