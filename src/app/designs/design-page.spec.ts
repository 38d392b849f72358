import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';

import { designScreen, plateDesign, version } from '../../testing/design-screen';
import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
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

  afterEach(() => httpMock.verify());

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
