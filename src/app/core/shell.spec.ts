import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Shell } from './shell';
import { Role } from './user';

describe('Shell navigation', () => {
  async function navLabels(role: Role): Promise<string[]> {
    TestBed.configureTestingModule({ imports: [Shell], providers: [provideRouter([]), signedInAs(role)] });
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    const nav = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatNavListHarness);
    return Promise.all((await nav.getItems()).map((item) => item.getTitle()));
  }

  it('offers studio fabric to the workroom as well as the owner', async () => {
    expect(await navLabels('workroom')).toEqual(['Commissions', 'Clients', 'Studio fabric']);
  });

  it('keeps studio fabric from a client', async () => {
    expect(await navLabels('client')).not.toContain('Studio fabric');
  });
});
