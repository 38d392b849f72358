import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatStepperHarness } from '@angular/material/stepper/testing';

import { labelledFields } from '../../testing/labelled-fields';
import { GarmentIntake } from './garment-intake';

describe('GarmentIntake, kept features', () => {
  let fixture: ComponentFixture<GarmentIntake>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [GarmentIntake], providers: [provideHttpClient(), provideHttpClientTesting()] });
    fixture = TestBed.createComponent(GarmentIntake);
    fixture.componentRef.setInput('commissionId', 3);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const { field, input } = labelledFields(() => loader);
  const step = async (label: string) => (await (await loader.getHarness(MatStepperHarness)).getSteps({ label }))[0]!.select();

  async function logWithPosition(position: string): Promise<void> {
    await (await input('Description')).setValue('Green checked flannel shirt');
    await step('Kept features');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a kept feature/ }))).click();
    await (await input('Where on the garment')).setValue(position);
    await (await input('Where on the garment')).blur();
    await step('Photos');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save garment' }))).click();
    await fixture.whenStable();
  }

  it('sends a position as long as the server keeps, 200 characters (the details form allows the same)', async () => {
    const position = `left chest, ${'under the flap '.repeat(20)}`.slice(0, 200);
    await logWithPosition(position);
    const request = httpMock.expectOne('/api/commissions/3/garments');
    expect(request.request.body.features).toEqual([{ kind: 'pocket', position: position.trim() }]);
  });

  it('refuses a longer one before sending, and says the limit', async () => {
    await logWithPosition('x'.repeat(201));
    httpMock.expectNone('/api/commissions/3/garments');
    await step('Kept features');
    expect(await (await field('Where on the garment')).getTextErrors()).toEqual(['At most 200 characters.']);
  });

  it('takes a description as long as the server keeps (300 characters) and says the limit past it', async () => {
    await (await input('Description')).setValue('d'.repeat(301));
    await (await input('Description')).blur();
    expect(await (await field('Description')).getTextErrors()).toEqual(['At most 300 characters']);
    await (await input('Description')).setValue('d'.repeat(300));
    await step('Photos');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save garment' }))).click();
    await fixture.whenStable();
    expect(httpMock.expectOne('/api/commissions/3/garments').request.body.description).toBe('d'.repeat(300));
  });

  it('says the limit on the other text fields instead of refusing silently', async () => {
    await (await input('Its story')).setValue('s'.repeat(5001));
    await (await input('Its story')).blur();
    expect(await (await field('Its story')).getTextErrors()).toEqual(['At most 5000 characters']);
  });
});
