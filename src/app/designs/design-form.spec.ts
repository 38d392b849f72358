import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { DesignBody } from '@keepstitch/shared';

import { starterDesign } from './design';
import { DesignForm } from './design-form';

describe('DesignForm', () => {
  let fixture: ComponentFixture<DesignForm>;
  let loader: HarnessLoader;
  let emitted: DesignBody[];

  async function create(body: DesignBody = starterDesign('1828.8', '2235.2')): Promise<void> {
    TestBed.configureTestingModule({ imports: [DesignForm] });
    fixture = TestBed.createComponent(DesignForm);
    fixture.componentRef.setInput('design', body);
    fixture.componentRef.setInput('stock', [{ id: 3, name: 'Navy cotton', colour: 'Navy', fibre: 'cotton', widthMm: '1066.8', lengthMm: '3000' }]);
    emitted = [];
    fixture.componentInstance.designChange.subscribe((b) => emitted.push(b));
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  const input = async (label: string) => (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;
  const settle = async () => {
    await new Promise((r) => setTimeout(r, 200));
    await fixture.whenStable();
  };

  it('shows the stored design in inches for editing', async () => {
    await create();
    // starterDesign: 72 x 88 in target, 12 in blocks, 2 in sashing.
    expect(await (await input('Target width')).getValue()).toBe('72');
    expect(await (await input('Block size (finished)')).getValue()).toBe('12');
    expect(await (await input('Sashing width')).getValue()).toBe('2');
  });

  it('sends lengths typed as fractions as exact millimetres', async () => {
    await create();
    await (await input('Block size (finished)')).setValue('10 1/2');
    await (await input('Borders, innermost first')).setValue('2, 6 1/4');
    await settle();
    const last = emitted[emitted.length - 1]!;
    // Published: 1 in = 25.4 mm exactly; 10 1/2 in = 266.7 mm, 6 1/4 in = 158.75 mm.
    expect(last.layout.blockMm).toBe('266.7');
    expect(last.layout.borders).toEqual(['50.8', '158.75']);
  });

  it('says what is wrong with a length it cannot read, and sends nothing', async () => {
    await create();
    const block = await input('Block size (finished)');
    await block.setValue('twelve');
    await block.blur();
    await settle();
    expect(emitted.length).toBe(0);
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Block size (finished)' }));
    expect((await field.getTextErrors()).join(' ')).toMatch(/not a length/i);
  });

  it('adds a plate block with its blades and radii, and refuses a pattern naming a block it does not have', async () => {
    await create();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a block kind/ }))).click();
    const kinds = await loader.getAllHarnesses(MatSelectHarness.with({ selector: '[formControlName="kind"]' }));
    await kinds[1]!.open();
    await kinds[1]!.clickOptions({ text: 'Plate' });
    await fixture.whenStable();
    const outer = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Outer radius' }));
    await ((await outer[0]!.getControl(MatInputHarness))!).setValue('4 1/2');
    await (await input('Pattern (block ids row by row, repeating)')).setValue('A B C');
    await settle();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No block C in the design.');
    const sentBefore = emitted.length;
    await (await input('Pattern (block ids row by row, repeating)')).setValue('A B');
    await settle();
    expect(emitted.length).toBeGreaterThan(sentBefore);
    const last = emitted[emitted.length - 1]!;
    expect(last.pattern).toEqual(['A', 'B']);
    expect(last.blocks[1]).toEqual(jasmine.objectContaining({ id: 'B', kind: 'plate', blades: 20, outerRadiusMm: '114.3' }));
  });

  it('keeps the assignments it was given', async () => {
    const body = { ...starterDesign('1828.8', '2235.2'), assignments: [{ target: { kind: 'position' as const, index: 0 }, fabric: { kind: 'stock' as const, stockId: 3 } }] };
    await create(body);
    await (await input('Rows')).setValue('3');
    await settle();
    expect(emitted[emitted.length - 1]!.assignments).toEqual(body.assignments);
    expect(emitted[emitted.length - 1]!.layout.rows).toBe(3);
  });
});
