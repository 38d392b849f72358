import { Component } from '@angular/core';
import { FormArray } from '@angular/forms';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';

import { KeptFeatureForm, keptFeatureForm } from './kept-feature-form';
import { KeptFeaturesEditor } from './kept-features-editor';

@Component({
  imports: [KeptFeaturesEditor],
  template: '<ks-kept-features-editor [features]="features" emptyText="Nothing kept yet." />',
})
class Host {
  readonly features = new FormArray<KeptFeatureForm>([keptFeatureForm({ kind: 'label', position: 'inside collar' })]);
}

describe('KeptFeaturesEditor', () => {
  let fixture: ComponentFixture<Host>;
  let loader: HarnessLoader;

  beforeEach(async () => {
    fixture = TestBed.createComponent(Host);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  it('adds and removes rows of the form array the parent owns, and says when there are none', async () => {
    const features = fixture.componentInstance.features;
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a kept feature/ }))).click();
    expect(features.length).toBe(2);
    expect(features.at(1).getRawValue()).toEqual({ kind: 'pocket', position: '' });

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove kept feature 1"]' }))).click();
    expect(features.getRawValue()).toEqual([{ kind: 'pocket', position: '' }]);
    expect(features.dirty).toBeTrue();

    features.at(0).controls.position.markAsTouched();
    await fixture.whenStable();
    const where = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Where on the garment' }));
    expect(await where.getTextErrors()).toEqual(['Say where it is, e.g. left chest']);

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove kept feature 1"]' }))).click();
    expect((fixture.nativeElement as HTMLElement).querySelector('.hint')?.textContent).toContain('Nothing kept yet.');
  });
});
