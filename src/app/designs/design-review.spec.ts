import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { DesignBody, deriveDesign } from '@keepstitch/shared';

import { plateDesign, threeShirts } from '../../testing/design-screen';
import { Notices } from '../core/notices';
import { SharedDesign, groupFabric } from './design';
import { DesignReview } from './design-review';

describe('DesignReview (the client)', () => {
  let fixture: ComponentFixture<DesignReview>;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  const body: DesignBody = { ...plateDesign(), groups: [{ id: 'g1', name: 'The blues', garmentIds: [8, 9] }], assignments: [{ target: { kind: 'position', index: 1 }, fabric: { kind: 'group', groupId: 'g1' } }] };
  const legend = threeShirts().fabrics;
  const shared: SharedDesign = {
    commission: { id: 5, title: 'Work-shirt memory quilt' },
    version: 2,
    sharedAt: '2026-11-02T10:00:00.000Z',
    body,
    derived: deriveDesign(body),
    fabrics: [...legend, groupFabric(body.groups![0]!, legend)].map(({ key, kind, name, hex, stripes }) => ({ key, kind, name, hex, ...(stripes ? { stripes } : {}) })),
    keptFeatures: [{ position: 0, rail: null, feature: 'breast pocket', garment: 'Green checked flannel shirt' }],
    clientResponse: null,
    clientNote: null,
    respondedAt: null,
  };

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DesignReview],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['info', 'error']) }],
    });
    fixture = TestBed.createComponent(DesignReview);
    fixture.componentRef.setInput('id', '5');
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    httpMock.expectOne('/api/commissions/5/design/shared').flush(shared);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  it("shows a group in the legend in stripes of its garments' colours, not its first garment's", () => {
    const item = [...page.querySelectorAll('[data-testid="review-fabric"]')].find((li) => li.textContent!.includes('The blues'))!;
    const swatch = item.querySelector<HTMLElement>('.swatch')!.style.background;
    expect(swatch).toContain('repeating-linear-gradient');
    expect(swatch).toContain('rgb(157, 183, 213)');
    expect(swatch).toContain('rgb(38, 53, 93)');
  });

  it('shows the client where the pocket is kept', () => {
    expect(page.querySelector('[data-testid="kept-mark"]')!.getAttribute('aria-label')).toBe('Block 1 keeps the breast pocket from the Green checked flannel shirt');
    expect(page.querySelector('[data-testid="kept-legend"]')!.textContent).toContain('Block 1 keeps the breast pocket from the Green checked flannel shirt.');
  });
});
