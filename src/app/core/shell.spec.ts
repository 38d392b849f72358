import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatNavListHarness } from '@angular/material/list/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { signedInAs } from '../../testing/signed-in-as';
import { Shell } from './shell';
import { Role } from './user';

@Component({
  selector: 'ks-test-note-dialog',
  imports: [MatFormFieldModule, MatInputModule],
  template: '<mat-form-field><mat-label>Note</mat-label><input matInput /></mat-form-field>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class NoteDialog {}

@Component({
  selector: 'ks-test-page',
  imports: [MatIconModule],
  template: '<mat-icon>mail</mat-icon><button type="button" (click)="addNote()">Add a note</button>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class NotingPage {
  private readonly dialog = inject(MatDialog);

  protected addNote(): void {
    this.dialog.open(NoteDialog);
  }
}

describe('Shell navigation', () => {
  async function navLabels(role: Role): Promise<string[]> {
    TestBed.configureTestingModule({ imports: [Shell], providers: [provideRouter([]), signedInAs(role)] });
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    const nav = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatNavListHarness);
    return Promise.all((await nav.getItems()).map((item) => item.getTitle()));
  }

  it('offers studio fabric to the workroom as well as the owner', async () => {
    expect(await navLabels('workroom')).toEqual(['What is due', 'Commissions', 'Clients', 'Studio fabric', 'Change password']);
  });

  it('lets every role change its own password', async () => {
    expect(await navLabels('client')).toContain('Change password');
    TestBed.resetTestingModule();
    expect(await navLabels('owner')).toContain('Change password');
  });

  it('keeps studio fabric from a client', async () => {
    expect(await navLabels('client')).not.toContain('Studio fabric');
  });
});

describe('Shell settings for the pages inside it', () => {
  it('gives pages, and the dialogs they open, the bundled icon font and outlined fields', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: '', component: Shell, children: [{ path: 'notes', component: NotingPage }] }]),
        signedInAs('owner'),
      ],
    });
    const harness = await RouterTestingHarness.create('/notes');
    const page: HTMLElement = harness.fixture.nativeElement.querySelector('ks-test-page');
    expect(page.querySelector('mat-icon')!.classList).toContain('material-symbols-outlined');

    page.querySelector('button')!.click();
    await harness.fixture.whenStable();
    const field = await TestbedHarnessEnvironment.documentRootLoader(harness.fixture).getHarness(MatFormFieldHarness);
    expect(await field.getAppearance()).toBe('outline');
    TestBed.inject(MatDialog).closeAll();
  });
});
