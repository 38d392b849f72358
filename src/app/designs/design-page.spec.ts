import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import { DesignBody, GarmentGroup, deriveDesign } from '@keepstitch/shared';

import { designScreen, emptyPlan, plateDesign, threeShirts, version } from '../../testing/design-screen';
import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { groupFabric } from './design';
import { DesignPage } from './design-page';

describe('DesignPage', () => {
  let fixture: ComponentFixture<DesignPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  // Version 2 is current (3 rows of 3); version 1 had 2 rows of 2 and a note.
  const v2 = version(2, plateDesign({ layout: { setting: 'straight', rows: 3, columns: 3, blockMm: '304.8', sashing: null, borders: [] } }));
  const v1 = version(1, plateDesign(), { note: 'First idea', clientResponse: 'changes_requested', clientNote: 'Bigger, please' });

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DesignPage],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('workroom'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) },
      ],
    });
    fixture = TestBed.createComponent(DesignPage);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(v2, [v1]));
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it('links a print page for the cut list, sewing order, templates and care card', async () => {
    const href = async (text: string) => (await (await loader.getHarness(MatButtonHarness.with({ text }))).host()).getAttribute('href');
    expect(await href('Cut list to print')).toBe('/designs/5/cut-list');
    expect(await href('Sewing order to print')).toBe('/designs/5/sewing-order');
    expect(await href('Templates to print')).toBe('/designs/5/templates');
    expect(await href('Care card to print')).toBe('/designs/5/care-card');
  });

  it('opens an earlier version read only, from the server, and closes it', async () => {
    const rows = [...page.querySelectorAll('[data-testid="version-row"]')].map((r) => r.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Version 2');
    expect(rows[0]).toContain('current');
    expect(rows[1]).toContain('Version 1');
    expect(rows[1]).toContain('First idea');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'View version 2' }))).toEqual([]);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'View version 1' }))).click();
    httpMock.expectOne('/api/commissions/5/design/versions/1').flush(v1);
    await fixture.whenStable();

    const view = page.querySelector<HTMLElement>('[data-testid="version-view"]')!;
    expect(view.querySelector('h3')!.textContent).toBe('Version 1 (read only)');
    const facts = [...view.querySelectorAll('[data-testid="version-facts"] div')].map((d) => `${d.querySelector('dt')!.textContent}: ${d.querySelector('dd')!.textContent!.replace(/\s+/g, ' ').trim()}`);
    // Version 1: 2 x 2 blocks of 12 in, so 24 in (61 cm) square; the current design is 3 x 3.
    expect(facts).toContain('Finished: 24 in (61 cm) × 24 in (61 cm)');
    expect(facts).toContain('Layout: 2 rows of 2, 12 in (30.5 cm) blocks');
    expect(facts).toContain('Cut plan: 10 of 12 pieces placed; garment yield 50%');
    expect(view.textContent).toContain('asked for a change: “Bigger, please”');
    // Nothing in it can be edited: no fields, and its drawing is of version 1's four blocks.
    expect(view.querySelectorAll('input, textarea, mat-select').length).toBe(0);
    const positions = new Set([...view.querySelectorAll('[data-testid="quilt-drawing"] [data-position]')].map((e) => e.getAttribute('data-position')));
    expect(positions.size).toBe(4);
    expect(page.querySelector('[data-testid="design-version"]')!.textContent).toContain('Version 2');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Close version 1' }))).click();
    expect(page.querySelector('[data-testid="version-view"]')).toBeNull();
  });

  it('says why an earlier version could not be opened', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'View version 1' }))).click();
    httpMock
      .expectOne('/api/commissions/5/design/versions/1')
      .flush({ error: { code: 'not-found', message: 'That design version was not found.' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="version-view"]')).toBeNull();
    expect([...page.querySelectorAll('[role="alert"]')].map((a) => a.textContent).join(' ')).toContain('That design version was not found.');
  });
});

describe('DesignPage, groups of garments (owner)', () => {
  let fixture: ComponentFixture<DesignPage>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let page: HTMLElement;
  const blues: GarmentGroup = { id: 'g1', name: 'The blues', garmentIds: [8, 9] };
  const toBlues = { kind: 'group' as const, groupId: 'g1' };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DesignPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), signedInAs('owner'), { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) }],
    });
    fixture = TestBed.createComponent(DesignPage);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(version(1), [], threeShirts()));
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  /** The previews sent after the page's 400 ms pause, answered with a legend that knows the design's groups. */
  async function previews(): Promise<DesignBody[]> {
    await new Promise((r) => setTimeout(r, 500));
    await fixture.whenStable();
    const sent = httpMock.match('/api/commissions/5/design/preview');
    for (const req of sent) {
      const body = req.request.body as DesignBody;
      const legend = threeShirts().fabrics;
      req.flush({ derived: deriveDesign(body), plan: emptyPlan(12, 12), fabrics: [...legend, ...(body.groups ?? []).map((g) => groupFabric(g, legend))] });
    }
    await fixture.whenStable();
    return sent.map((r) => r.request.body as DesignBody);
  }

  async function makeTheBlues(): Promise<void> {
    await (await button(/New group/)).click();
    await (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Group name' }))).getControl(MatInputHarness))!.setValue('The blues');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Blue oxford work shirt' }))).check();
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Navy knit polo' }))).check();
    await (await button('Add group')).click();
    await fixture.whenStable();
  }

  it('makes a named group of garments, kept in the design at once, which the legend shows in stripes of its garments', async () => {
    await makeTheBlues();
    const row = page.querySelector<HTMLElement>('[data-testid="group-row"]')!;
    expect(row.textContent).toContain('The blues');
    expect(row.textContent).toContain('Blue oxford work shirt, Navy knit polo');
    expect(row.textContent).toContain('not given to anything yet');
    const chip = page.querySelector<HTMLElement>('[data-testid="fabric-chip"][data-fabric="group:g1"]')!;
    expect(chip.textContent).toContain('The blues');
    expect(chip.textContent).toContain('any of 2 garments');
    // Its swatch is striped with its garments' colours, blue (157, 183, 213) and navy (38, 53, 93).
    const swatch = chip.querySelector<HTMLElement>('.swatch')!.style.background;
    expect(swatch).toContain('repeating-linear-gradient');
    expect(swatch).toContain('rgb(157, 183, 213)');
    expect(swatch).toContain('rgb(38, 53, 93)');
    // Given to nothing, it is in the design all the same.
    const sent = await previews();
    expect(sent[sent.length - 1]!.groups).toEqual([blues]);
    expect(sent[sent.length - 1]!.assignments).toEqual([]);
  });

  it('saves a group given to nothing, and shows it again from the stored design', async () => {
    await makeTheBlues();
    await previews();
    await (await button('Save as new version')).click();
    const save = httpMock.expectOne({ method: 'POST', url: '/api/commissions/5/design' });
    const saved = (save.request.body as { body: DesignBody }).body;
    expect(saved.groups).toEqual([blues]);
    expect(saved.assignments).toEqual([]);
    save.flush(version(2, saved));
    await fixture.whenStable();
    const legend = threeShirts().fabrics;
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(version(2, saved), [version(1)], { ...threeShirts(), fabrics: [...legend, groupFabric(blues, legend)] }));
    await fixture.whenStable();
    const row = page.querySelector<HTMLElement>('[data-testid="group-row"]')!;
    expect(row.textContent).toContain('The blues');
    expect(row.textContent).toContain('not given to anything yet');
  });

  it('refuses a group of one garment, a second group of the same garments and a name taken', async () => {
    await makeTheBlues();
    await (await button(/New group/)).click();
    const name = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Group name' }))).getControl(MatInputHarness))!;
    await name.setValue('Shirts');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Blue oxford work shirt' }))).check();
    await (await button('Add group')).click();
    expect(page.textContent).toContain('Tick two garments at least');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Navy knit polo' }))).check();
    await (await button('Add group')).click();
    expect(page.textContent).toContain('The group “The blues” has these garments already.');
    await name.setValue('the Blues');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Green checked flannel shirt' }))).check();
    await (await button('Add group')).click();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Group name' }));
    expect(await field.getTextErrors()).toEqual(['Another group has that name.']);
    expect(page.querySelectorAll('[data-testid="group-row"]').length).toBe(1);
    await previews();
  });

  it('assigns the group to a kind of piece by the table and to a block by its menu, and sends it in the preview and the saved body', async () => {
    await makeTheBlues();
    const select = await loader.getHarness(MatSelectHarness.with({ selector: '[aria-label="Fabric for Block A (Plain square): square"]' }));
    await select.open();
    await select.clickOptions({ text: 'The blues' });
    // Keyboard users: a block tile is a button opening a menu of the fabrics.
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '[data-testid="position-tile"][data-position="1"]' }));
    await menu.open();
    await menu.clickItem({ text: /The blues/ });
    await fixture.whenStable();

    const sent = await previews();
    expect(sent.length).toBeGreaterThan(0);
    const last = sent[sent.length - 1]!;
    expect(last.groups).toEqual([blues]);
    expect(last.assignments).toContain({ target: { kind: 'piece', key: 'block:A:square' }, fabric: toBlues });
    expect(last.assignments).toContain({ target: { kind: 'position', index: 1 }, fabric: toBlues });

    // The drawing fills the group's places with stripes of its garments' colours (blue and navy).
    const tile = page.querySelector<HTMLElement>('[data-testid="position-tile"][data-position="1"]')!;
    expect(tile.getAttribute('data-fabric')).toBe('group:g1');
    expect(tile.getAttribute('aria-label')).toBe('Block 2 (B): The blues');
    const drawing = page.querySelector('[data-testid="quilt-drawing"]')!;
    const filled = [...drawing.querySelectorAll('polygon[data-fill="group:g1"]')];
    expect(filled.length).toBeGreaterThan(1);
    const pattern = drawing.querySelector('pattern[data-group="group:g1"]')!;
    expect(filled.every((p) => p.getAttribute('fill') === `url(#${pattern.id})`)).toBeTrue();
    expect([...pattern.querySelectorAll('rect')].map((r) => r.getAttribute('fill'))).toEqual(['#9db7d5', '#26355d']);
    expect(page.querySelector('[data-testid="group-row"]')!.textContent).toContain('given to 2 places');

    await (await button('Save as new version')).click();
    const save = httpMock.expectOne({ method: 'POST', url: '/api/commissions/5/design' });
    const saved = (save.request.body as { body: DesignBody }).body;
    expect(saved.groups).toEqual([blues]);
    expect(saved.assignments).toContain({ target: { kind: 'piece', key: 'block:A:square' }, fabric: toBlues });
    expect(saved.assignments).toContain({ target: { kind: 'position', index: 1 }, fabric: toBlues });
    save.flush(version(2, saved));
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/design').flush(designScreen(version(2, saved), [version(1)], threeShirts()));
    await fixture.whenStable();
    // Read back from the stored design, the group is still there.
    expect(page.querySelector('[data-testid="group-row"]')!.textContent).toContain('The blues');
  });

  it('renames a group and changes its garments, the places given it keeping it, and removing it gives its places back to the planner', async () => {
    await makeTheBlues();
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '[data-testid="position-tile"][data-position="0"]' }));
    await menu.open();
    await menu.clickItem({ text: /The blues/ });
    await fixture.whenStable();

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Change the group The blues"]' }))).click();
    await (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Group name' }))).getControl(MatInputHarness))!.setValue('Cool colours');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Green checked flannel shirt' }))).check();
    await (await button('Save group')).click();
    await fixture.whenStable();
    expect(page.querySelectorAll('[data-testid="group-row"]').length).toBe(1);
    expect(page.querySelector('[data-testid="group-row"]')!.textContent).toContain('Cool colours');
    let sent = await previews();
    expect(sent[sent.length - 1]!.groups).toEqual([{ id: 'g1', name: 'Cool colours', garmentIds: [8, 9, 10] }]);
    expect(sent[sent.length - 1]!.assignments).toEqual([{ target: { kind: 'position', index: 0 }, fabric: toBlues }]);

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove the group Cool colours"]' }))).click();
    await fixture.whenStable();
    expect(page.querySelectorAll('[data-testid="group-row"]').length).toBe(0);
    expect([...page.querySelectorAll('[data-testid="fabric-chip"]')].map((c) => c.textContent).join(' ')).not.toContain('Cool colours');
    sent = await previews();
    expect(sent[sent.length - 1]!.groups).toEqual([]);
    expect(sent[sent.length - 1]!.assignments).toEqual([]);
  });

  it('marks in the drawing the block the plan keeps the pocket in, with a key', async () => {
    const plan = { ...emptyPlan(12, 12), keptFeatures: [{ featureId: 'panel-101-feature-1', feature: 'breast pocket', garmentId: 10, garment: 'Green checked flannel shirt', panel: 'left front', pieceId: 'p1', copy: 2 }] };
    const body = version(1).body;
    await makeTheBlues();
    await new Promise((r) => setTimeout(r, 500));
    for (const req of httpMock.match('/api/commissions/5/design/preview')) req.flush({ derived: deriveDesign(req.request.body as DesignBody), plan, fabrics: threeShirts().fabrics });
    await fixture.whenStable();
    // plateDesign: A B / B A, so piece p1 (Block A squares, planner's choice) copy 2 is the second A: block 4.
    expect(deriveDesign(body).pieces[0]!.key).toBe('block:A:square');
    const mark = page.querySelector('[data-testid="quilt-drawing"] [data-testid="kept-mark"]')!;
    expect(mark.getAttribute('data-kept-position')).toBe('3');
    expect(mark.getAttribute('aria-label')).toBe('Block 4 keeps the breast pocket from the Green checked flannel shirt');
    expect(page.querySelector('[data-testid="quilt-drawing"]')!.getAttribute('aria-label')).toContain('Block 4 keeps the breast pocket');
    expect(page.querySelector('[data-testid="kept-legend"]')!.textContent).toContain('Block 4 keeps the breast pocket from the Green checked flannel shirt.');
  });
});
