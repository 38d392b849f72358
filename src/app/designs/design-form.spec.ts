import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { BLOCK_KIND_MODULES, BlockSpec, DesignBody, KindInput } from '@keepstitch/shared';

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

  it('keeps what is being typed when only the fabric choices change, and sends the groups and assignments made since', async () => {
    const body = starterDesign('1828.8', '2235.2');
    await create(body);
    const rows = await input('Rows');
    await rows.setValue('');
    // The fabric board makes two groups while the rows field is empty, and gives one of them to block 1.
    const groups = [
      { id: 'g1', name: 'The blues', garmentIds: [8, 9] },
      { id: 'g2', name: 'Not given yet', garmentIds: [9, 10] },
    ];
    const assignments = [{ target: { kind: 'position' as const, index: 0 }, fabric: { kind: 'group' as const, groupId: 'g1' } }];
    fixture.componentRef.setInput('design', { ...body, groups, assignments });
    await fixture.whenStable();
    expect(await rows.getValue()).toBe('');
    await rows.setValue('3');
    await settle();
    expect(emitted[emitted.length - 1]!.layout.rows).toBe(3);
    expect(emitted[emitted.length - 1]!.groups).toEqual(groups);
    expect(emitted[emitted.length - 1]!.assignments).toEqual(assignments);
  });

  /** A value for an input other than the one a new block starts with, so a dropped field cannot pass as a default. */
  const setValue = (input: KindInput): number | string => {
    switch (input.type) {
      case 'count':
        return Math.min(input.max, input.default + 2);
      case 'length':
        return '114.3'; // Published: 4 1/2 in = 114.3 mm exactly.
      case 'choice':
        return input.options[input.options.length - 1]!.value;
    }
  };

  it('keeps every field of a block of every kind when a design is opened and saved unchanged', async () => {
    const blocks = BLOCK_KIND_MODULES.map((k, i) => ({
      id: 'ABCDEFGHIJKL'[i]!,
      name: k.label,
      kind: k.kind,
      ...Object.fromEntries(k.inputs.map((input) => [input.name, setValue(input)])),
    })) as BlockSpec[];
    const body: DesignBody = { ...starterDesign('1828.8', '2235.2'), blocks, pattern: blocks.map((b) => b.id) };
    await create(body);
    expect(fixture.componentInstance.value()).toEqual(body);
  });

  it('offers the flying geese method and sends the one chosen', async () => {
    await create({ ...starterDesign('1828.8', '2235.2'), blocks: [{ id: 'A', name: 'Geese', kind: 'flying-geese', units: 2 }] });
    const method = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Method' }))).getControl(MatSelectHarness))!;
    expect(await method.getValueText()).toBe('Four at a time');
    await method.open();
    await method.clickOptions({ text: 'Stitch and flip' });
    await settle();
    expect(emitted[emitted.length - 1]!.blocks[0]).toEqual({ id: 'A', name: 'Geese', kind: 'flying-geese', units: 2, method: 'stitch-and-flip' });
  });

  describe('bed size', () => {
    const bed = () => loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="preset"]' }));
    const units = () => loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="units"]' }));
    const last = () => emitted[emitted.length - 1]!;

    it('fills the target from a UK double with a 30 cm drop, through the shared bed maths', async () => {
      await create();
      await (await units()).open();
      await (await units()).clickOptions({ text: /Centimetres/ });
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'UK double' });
      await (await input('Drop each side')).setValue('30');
      await settle();
      // Published: a UK double mattress is 135 x 190 cm; derived: 135 + 2 x 30 = 195 cm wide, 190 + 30 = 220 cm long.
      expect(last().target).toEqual({ preset: 'uk-double', dropMm: '300', widthMm: '1950', lengthMm: '2200' });
      expect(await (await input('Target width')).getValue()).toBe('195');
      expect(await (await input('Target length')).getValue()).toBe('220');
      expect(await (await input('Target width')).isDisabled()).toBeTrue();
      expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="bed-hint"]')!.textContent).toContain('Mattress 135 cm × 190 cm');
    });

    it('adds a pillow tuck to the length only', async () => {
      await create();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'US queen' });
      await (await input('Drop each side')).setValue('12');
      await (await input('Pillow tuck')).setValue('10');
      await settle();
      // Published: US queen 60 x 80 in; derived: 60 + 2 x 12 = 84 in = 2133.6 mm; 80 + 12 + 10 = 102 in = 2590.8 mm.
      expect(last().target).toEqual({ preset: 'us-queen', dropMm: '304.8', widthMm: '2133.6', lengthMm: '2590.8' });
      expect(await (await input('Target length')).getValue()).toBe('102');
    });

    it('starts a bed at a 10 in drop, the low end of the usual range', async () => {
      await create();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'US twin' });
      await settle();
      // Published: US twin 38 x 75 in; 38 + 20 = 58 in, 75 + 10 = 85 in.
      expect(await (await input('Drop each side')).getValue()).toBe('10');
      expect(last().target).toEqual({ preset: 'us-twin', dropMm: '254', widthMm: '1473.2', lengthMm: '2159' });
    });

    it('shows a stored bed size with its drop, and the tuck the length holds beyond them', async () => {
      const body = starterDesign('1828.8', '2235.2');
      // US full 54 x 75 in with a 12 in drop and a 10 in tuck: 78 x 97 in.
      await create({ ...body, target: { preset: 'us-full', dropMm: '304.8', widthMm: '1981.2', lengthMm: '2463.8' } });
      expect(await (await bed()).getValueText()).toBe('US full');
      expect(await (await input('Drop each side')).getValue()).toBe('12');
      expect(await (await input('Pillow tuck')).getValue()).toBe('10');
      expect(await (await input('Target width')).getValue()).toBe('78');
    });

    it('shows a metric bed in inches as a ruler reads it, and sends the exact size', async () => {
      await create();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'UK double' });
      await (await input('Drop each side')).setValue('12');
      await settle();
      // Published: UK double 135 x 190 cm, 1 in = 25.4 mm. Derived: 1350 + 2 x 304.8 = 1959.6 mm = 77.1496 in,
      // read on the ruler as 77 1/8; 1900 + 304.8 = 2204.8 mm = 86.8031 in, read as 86 3/4.
      expect(await (await input('Target width')).getValue()).toBe('77 1/8');
      expect(await (await input('Target length')).getValue()).toBe('86 3/4');
      expect(last().target).toEqual({ preset: 'uk-double', dropMm: '304.8', widthMm: '1959.6', lengthMm: '2204.8' });
    });

    it('opens a stored size that the bed and drop do not give as the typed size it is, and keeps it', async () => {
      const body = starterDesign('1828.8', '2235.2');
      // A UK double with a 12 in drop is 77 1/8 in wide, not 72: the stored 72 x 88 in is kept as typed.
      await create({ ...body, target: { preset: 'uk-double', dropMm: '304.8', widthMm: '1828.8', lengthMm: '2235.2' } });
      expect(await (await bed()).getValueText()).not.toContain('UK double');
      expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="bed-hint"]')).toBeNull();
      expect(await (await input('Target width')).isDisabled()).toBeFalse();
      expect(await (await input('Target width')).getValue()).toBe('72');
      expect(fixture.componentInstance.value()?.target).toEqual({ preset: null, dropMm: null, widthMm: '1828.8', lengthMm: '2235.2' });
    });

    it('refuses a drop over 100 cm and sends nothing', async () => {
      await create();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'UK single' });
      await settle();
      const before = emitted.length;
      const drop = await input('Drop each side');
      await drop.setValue('50');
      await drop.blur();
      await settle();
      expect(emitted.length).toBe(before);
      const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Drop each side' }));
      expect((await field.getTextErrors()).join(' ')).toContain('at most 100 cm');
    });

    it('goes back to a typed size, keeping the bed size to edit from', async () => {
      await create();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: 'US queen' });
      await settle();
      await (await bed()).open();
      await (await bed()).clickOptions({ text: /Custom size/ });
      const width = await input('Target width');
      expect(await width.isDisabled()).toBeFalse();
      expect(await width.getValue()).toBe('80');
      await width.setValue('81 1/2');
      await settle();
      // Published: 1 in = 25.4 mm; 81 1/2 in = 2070.1 mm; 80 + 10 in = 90 in = 2286 mm.
      expect(last().target).toEqual({ preset: null, dropMm: null, widthMm: '2070.1', lengthMm: '2286' });
    });
  });
});
