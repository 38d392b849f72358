import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { provideRouter } from '@angular/router';

import { OverviewPage, daysText, waitingText } from './overview-page';
import { Overview } from './overview-api';

const empty: Overview = { today: '2026-12-04', thisWeekEnds: '2026-12-06', nextWeekEnds: '2026-12-13', deadlines: [], garmentsExpected: [], designsAwaiting: [], quotesExpiring: [], balancesDue: [] };

const full: Overview = {
  ...empty,
  deadlines: [
    { commissionId: 3, title: 'Harbour memory quilt', clientName: 'Tove Pellam', stage: 'piecing', deadline: '2026-12-02', daysLeft: -2, week: 'overdue' },
    { commissionId: 4, title: 'Nursery cot quilt', clientName: 'Ilse Varden', stage: 'quilting', deadline: '2026-12-05', daysLeft: 1, week: 'this' },
    { commissionId: 5, title: 'Band shirt quilt', clientName: 'Ilse Varden', stage: 'booked', deadline: '2026-12-10', daysLeft: 6, week: 'next' },
  ],
  quotesExpiring: [{ quoteId: 9, commissionId: 6, title: 'Picnic quilt', version: 2, validUntil: '2026-12-07', daysLeft: 3, totalPence: 45000 }],
  balancesDue: [{ commissionId: 4, title: 'Nursery cot quilt', stage: 'quilting', deadline: '2026-12-05', balancePence: 31500 }],
  garmentsExpected: [{ garmentId: 11, commissionId: 5, title: 'Band shirt quilt', description: 'Black tour shirt', waitingDays: 16 }],
  designsAwaiting: [{ commissionId: 7, title: 'Wedding ring quilt', version: 1, sharedOn: '2026-12-01', waitingDays: 3 }],
};

describe('OverviewPage', () => {
  let fixture: ComponentFixture<OverviewPage>;
  let httpMock: HttpTestingController;
  let page: HTMLElement;

  async function open(answer: Overview | 'fail'): Promise<void> {
    TestBed.configureTestingModule({ imports: [OverviewPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    fixture = TestBed.createComponent(OverviewPage);
    httpMock = TestBed.inject(HttpTestingController);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    const req = httpMock.expectOne('/api/overview');
    if (answer === 'fail') req.flush({ error: { code: 'unavailable', message: 'The database is not answering.' } }, { status: 503, statusText: 'Unavailable' });
    else req.flush(answer);
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  const section = (heading: string) => [...page.querySelectorAll('section.due')].find((s) => s.querySelector('h2')?.textContent?.trim() === heading) as HTMLElement | undefined;
  const links = (heading: string) => [...section(heading)!.querySelectorAll('a')].map((a) => ({ href: a.getAttribute('href'), text: a.textContent!.replace(/\s+/g, ' ').trim() }));

  it('says for each section that nothing is due when nothing is', async () => {
    await open(empty);
    expect(section('Deadlines this week and next')!.textContent).toContain('No deadlines before 13 Dec 2026');
    expect(section('Quotes about to run out')!.textContent).toContain('No sent quote runs out in the next week.');
    expect(section('Balances due')!.textContent).toContain('No balance is owed');
    expect(section('Garments still expected')!.textContent).toContain('Every garment logged has arrived.');
    expect(section('Designs awaiting the client’s answer')!.textContent).toContain('No shared design is waiting');
    expect(page.querySelectorAll('a').length).toBe(0);
  });

  it('groups the deadlines into overdue, this week and next, each with its stage and a link to its commission', async () => {
    await open(full);
    const headings = [...section('Deadlines this week and next')!.querySelectorAll('h3')].map((h) => h.textContent!.trim());
    expect(headings).toEqual(['Overdue', 'This week, to 6 Dec 2026', 'Next week, to 13 Dec 2026']);
    expect(links('Deadlines this week and next')).toEqual([
      { href: '/commissions/3', text: jasmine.stringContaining('Harbour memory quilt') as unknown as string },
      { href: '/commissions/4', text: jasmine.stringContaining('tomorrow') as unknown as string },
      { href: '/commissions/5', text: jasmine.stringContaining('Booked') as unknown as string },
    ]);
    expect(links('Deadlines this week and next')[0]!.text).toContain('Piecing');
    expect(links('Deadlines this week and next')[0]!.text).toContain('2 days ago');
  });

  it('links each quote, balance, garment and design to where it is dealt with', async () => {
    await open(full);
    expect(links('Quotes about to run out')).toEqual([{ href: '/commissions/6', text: jasmine.stringMatching(/Picnic quilt, version 2.*in 3 days.*£450\.00/) as unknown as string }]);
    expect(links('Balances due')).toEqual([{ href: '/commissions/4', text: jasmine.stringMatching(/Nursery cot quilt: £315\.00.*Quilting/) as unknown as string }]);
    expect(links('Garments still expected')).toEqual([{ href: '/commissions/5/garments/11', text: jasmine.stringMatching(/Black tour shirt.*for 16 days/) as unknown as string }]);
    expect(links('Designs awaiting the client’s answer')).toEqual([{ href: '/designs/7', text: jasmine.stringContaining('Wedding ring quilt, version 1') as unknown as string }]);
    const lists = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatNavListHarness);
    expect(lists.length).toBe(7);
  });

  it('leaves out the money sections when the server sends none (the workroom)', async () => {
    const { quotesExpiring: _q, balancesDue: _b, ...workroom } = full;
    await open(workroom);
    expect(section('Quotes about to run out')).toBeUndefined();
    expect(section('Balances due')).toBeUndefined();
    expect(page.textContent).not.toContain('£');
    expect(section('Garments still expected')).toBeDefined();
  });

  it('says what went wrong when it cannot load, and tries again', async () => {
    await open('fail');
    expect(page.querySelector('[role="alert"]')!.textContent).toContain('The database is not answering.');
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    httpMock.expectOne('/api/overview').flush(empty);
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')).toBeNull();
    expect(section('Balances due')).toBeDefined();
  });

  it('words days plainly', () => {
    expect([0, 1, -1, 4, -3].map(daysText)).toEqual(['today', 'tomorrow', 'yesterday', 'in 4 days', '3 days ago']);
    expect([0, 1, 12].map(waitingText)).toEqual(['since today', 'for 1 day', 'for 12 days']);
  });
});
