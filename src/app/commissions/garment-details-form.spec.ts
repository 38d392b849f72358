import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';

import { labelledFields } from '../../testing/labelled-fields';
import { GarmentDetail } from './commission';
import { GarmentDetailsForm } from './garment-details-form';

const shirt: GarmentDetail = {
  id: 21,
  commissionId: 3,
  description: 'Blue oxford work shirt',
  whose: 'Edmund',
  story: 'Worn every Sunday.',
  fibre: null,
  construction: 'woven',
  colour: 'Pale blue',
  print: 'plain',
  condition: 'Frayed cuffs',
  features: [{ kind: 'pocket', position: 'left chest' }],
  prewash: 'not_washed',
  colourRun: 'untested',
  returnsToClient: 'Collar',
};

describe('GarmentDetailsForm', () => {
  let fixture: ComponentFixture<GarmentDetailsForm>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let saved: GarmentDetail[];

  async function open(garment: GarmentDetail): Promise<void> {
    TestBed.configureTestingModule({
      imports: [GarmentDetailsForm],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    fixture = TestBed.createComponent(GarmentDetailsForm);
    fixture.componentRef.setInput('garment', garment);
    saved = [];
    fixture.componentInstance.saved.subscribe((g) => saved.push(g));
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  const { field, input, select } = labelledFields(() => loader);
  const save = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Save details' }))).click();

  it('starts from the garment as it is, with an unknown fibre left unset', async () => {
    await open(shirt);
    expect(await (await input('Description')).getValue()).toBe('Blue oxford work shirt');
    expect(await (await input('Its story')).getValue()).toBe('Worn every Sunday.');
    expect(await (await select('Fibre')).getValueText()).toBe('Not known yet');
    expect(await (await select('Woven or knit')).getValueText()).toBe('Woven');
    expect(await (await select('Pre-wash')).getValueText()).toBe('Not washed yet');
    expect(await (await input('Where on the garment')).getValue()).toBe('left chest');
    expect(await (await input('What goes back to the client')).getValue()).toBe('Collar');
  });

  it('sends only what changed: a fibre now known, a cleared colour, a colour-run result', async () => {
    await open(shirt);
    await (await select('Fibre')).clickOptions({ text: 'Linen' });
    await (await input('Colour')).setValue('  ');
    await (await select('Colour-run test')).clickOptions({ text: 'Passed (no colour ran)' });
    await save();
    const request = httpMock.expectOne('/api/garments/21');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ colour: null, fibre: 'linen', colourRun: 'passed' });
    request.flush({ ...shirt, fibre: 'linen', colour: null, colourRun: 'passed' });
    await fixture.whenStable();
    expect(saved.map((g) => g.fibre)).toEqual(['linen']);
  });

  it('sends the whole kept-feature list when one is added or removed', async () => {
    await open(shirt);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a kept feature/ }))).click();
    await fixture.whenStable();
    const kinds = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Feature' }));
    await (await kinds[1].getControl(MatSelectHarness))!.clickOptions({ text: 'Label' });
    const positions = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Where on the garment' }));
    await (await positions[1].getControl(MatInputHarness))!.setValue(' inside collar ');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove kept feature 1"]' }))).click();
    await save();
    expect(httpMock.expectOne('/api/garments/21').request.body).toEqual({ features: [{ kind: 'label', position: 'inside collar' }] });
  });

  it('does not offer "not known" once a fibre is set, since it cannot be unset', async () => {
    await open({ ...shirt, fibre: 'cotton' });
    const fibre = await select('Fibre');
    await fibre.open();
    const texts = await Promise.all((await fibre.getOptions()).map((o) => o.getText()));
    expect(texts).not.toContain('Not known yet');
    expect(texts).toContain('Cotton');
  });

  it('asks for a place for a new kept feature and sends nothing unchanged', async () => {
    await open(shirt);
    await save();
    httpMock.expectNone('/api/garments/21');
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Nothing has changed yet.');

    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a kept feature/ }))).click();
    await save();
    httpMock.expectNone('/api/garments/21');
    const positions = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Where on the garment' }));
    expect(await positions[1].getTextErrors()).toEqual(['Say where it is, e.g. left chest']);
  });

  it("shows the server's field messages under their fields, kept features included", async () => {
    await open(shirt);
    await (await input('Description')).setValue('Shirt');
    await (await input('Where on the garment')).setValue('back yoke');
    await save();
    httpMock.expectOne('/api/garments/21').flush(
      {
        error: {
          code: 'validation',
          message: 'The garment has 2 fields to correct.',
          fields: { description: 'Say a little more about it.', 'features.0.position': 'That place is taken.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(await (await field('Description')).getTextErrors()).toEqual(['Say a little more about it.']);
    expect(await (await field('Where on the garment')).getTextErrors()).toEqual(['That place is taken.']);
    expect(saved).toEqual([]);
  });

  it('holds a position to the same 200 characters as intake and the server, and says so past it', async () => {
    await open(shirt);
    await (await input('Where on the garment')).setValue('x'.repeat(201));
    await save();
    httpMock.expectNone('/api/garments/21');
    expect(await (await field('Where on the garment')).getTextErrors()).toEqual(['At most 200 characters.']);
    await (await input('Where on the garment')).setValue('x'.repeat(200));
    await save();
    expect(httpMock.expectOne('/api/garments/21').request.body).toEqual({ features: [{ kind: 'pocket', position: 'x'.repeat(200) }] });
  });

  it('says the limit of a text field past it instead of refusing silently', async () => {
    await open(shirt);
    await (await input('Condition')).setValue('c'.repeat(2001));
    await save();
    httpMock.expectNone('/api/garments/21');
    expect(await (await field('Condition')).getTextErrors()).toEqual(['At most 2000 characters']);
  });
});
