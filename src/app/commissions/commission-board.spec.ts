import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Notices } from '../core/notices';
import { Commission } from './commission';
import { CommissionBoard } from './commission-board';

function commission(id: number, title: string, stage: Commission['stage']): Commission {
  return {
    id,
    clientId: 4,
    client: { id: 4, name: 'Imogen Tallis' },
    title,
    kind: 'memory_quilt',
    recipient: null,
    ageGroup: 'adult',
    occasion: null,
    sizePreset: null,
    widthMm: null,
    lengthMm: null,
    deadline: '2027-03-01',
    daysLeft: 20,
    overdue: false,
    stage,
    createdAt: '2026-10-01T09:00:00Z',
  };
}

describe('CommissionBoard', () => {
  let fixture: ComponentFixture<CommissionBoard>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let notices: jasmine.SpyObj<Notices>;

  beforeEach(async () => {
    notices = jasmine.createSpyObj<Notices>('Notices', ['info', 'error']);
    TestBed.configureTestingModule({
      imports: [CommissionBoard],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: notices },
      ],
    });
    fixture = TestBed.createComponent(CommissionBoard);
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    const list = httpMock.expectOne((r) => r.url === '/api/commissions');
    expect(list.request.params.get('stage')).toBe(
      'enquiry,quoted,booked,garments_in,preparation,cutting,piecing,quilting,binding,ready,delivered',
    );
    list.flush({ items: [commission(1, 'Sunday shirts quilt', 'booked'), commission(2, 'Cot hanging', 'enquiry')], total: 2 });
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  function titlesIn(stage: string): string[] {
    const column = (fixture.nativeElement as HTMLElement).querySelector(`[data-testid="board-column-${stage}"]`)!;
    return Array.from(column.querySelectorAll('[data-testid="board-card"] .title')).map((a) => a.textContent!.trim());
  }

  async function moveByMenu(title: string, stage: string): Promise<void> {
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: `[aria-label="Move to… another stage: “${title}”"]` }));
    await menu.clickItem({ text: stage });
    await fixture.whenStable();
  }

  it('shows each commission in the column of its stage', () => {
    expect(titlesIn('booked')).toEqual(['Sunday shirts quilt']);
    expect(titlesIn('enquiry')).toEqual(['Cot hanging']);
    expect(titlesIn('cutting')).toEqual([]);
  });

  it('moves a card from its menu and keeps it where the server put it', async () => {
    await moveByMenu('Sunday shirts quilt', 'Garments in');
    expect(titlesIn('garments_in')).toEqual(['Sunday shirts quilt']);
    const request = httpMock.expectOne('/api/commissions/1/stage');
    expect(request.request.body).toEqual({ to: 'garments_in' });
    request.flush({ id: 1, stage: 'garments_in', nextStages: [] });
    await fixture.whenStable();
    expect(titlesIn('garments_in')).toEqual(['Sunday shirts quilt']);
    expect(titlesIn('booked')).toEqual([]);
  });

  it("puts a refused card back and shows the server's reason", async () => {
    await moveByMenu('Sunday shirts quilt', 'Garments in');
    httpMock.expectOne('/api/commissions/1/stage').flush(
      { error: { code: 'stage_refused', message: 'Record at least one garment as received before moving to "Garments in".' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(titlesIn('booked')).toEqual(['Sunday shirts quilt']);
    expect(titlesIn('garments_in')).toEqual([]);
    expect(notices.error).toHaveBeenCalledOnceWith(
      'Record at least one garment as received before moving to "Garments in".',
    );
  });
});
