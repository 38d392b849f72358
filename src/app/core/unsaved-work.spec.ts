import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { LEAVING_UNSAVED, UnsavedWork, keepUnsavedWork, unsavedWorkGuard } from './unsaved-work';

@Component({ imports: [ReactiveFormsModule], template: '<input aria-label="Note" [formControl]="note" />' })
class NotePage {
  readonly note = new FormControl('', { nonNullable: true });
  constructor() {
    keepUnsavedWork(() => this.note.dirty);
  }
}

@Component({ template: '<p>Elsewhere</p>' })
class OtherPage {}

async function until<T>(find: () => T | null | undefined): Promise<T> {
  for (let i = 0; i < 200; i++) {
    const found = find();
    if (found) return found;
    await new Promise((r) => setTimeout(r, 10));
  }
  throw new Error('Not found in time');
}

function dialogButton(name: string): HTMLButtonElement | undefined {
  return [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')].find((b) => b.textContent!.trim() === name);
}

describe('UnsavedWork', () => {
  let harness: RouterTestingHarness;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'note', canDeactivate: [unsavedWorkGuard], component: NotePage },
          { path: 'other', component: OtherPage },
        ]),
      ],
    });
    harness = await RouterTestingHarness.create('/note');
    router = TestBed.inject(Router);
  });

  function typeNote(text: string): void {
    const page = harness.routeDebugElement!.componentInstance as NotePage;
    page.note.setValue(text);
    page.note.markAsDirty();
  }

  /** A real beforeunload would end the test run, so the service's own listener is handed one. */
  function unload(): Event {
    const event = new Event('beforeunload', { cancelable: true });
    TestBed.inject(UnsavedWork).beforeUnload(event);
    return event;
  }

  it('lets the page go without asking when nothing was typed', async () => {
    expect(await router.navigateByUrl('/other')).toBeTrue();
    expect(document.querySelector('mat-dialog-container')).toBeNull();
  });

  it('asks before leaving typed work: staying keeps the page and what was typed', async () => {
    typeNote('Half a note');
    const leaving = router.navigateByUrl('/other');
    const stay = await until(() => dialogButton('Stay on this page'));
    expect(document.querySelector('mat-dialog-container h2')!.textContent).toBe('Leave without saving?');
    stay.click();
    expect(await leaving).toBeFalse();
    expect(router.url).toBe('/note');
    expect((harness.routeDebugElement!.componentInstance as NotePage).note.value).toBe('Half a note');
  });

  it('leaves when told to, and then nothing counts as unsaved', async () => {
    typeNote('Half a note');
    const leaving = router.navigateByUrl('/other');
    (await until(() => dialogButton('Leave without saving'))).click();
    expect(await leaving).toBeTrue();
    expect(router.url).toBe('/other');
    expect(TestBed.inject(UnsavedWork).any()).toBeFalse();
  });

  it('lets a leave the person already agreed to go without asking again', async () => {
    typeNote('Half a note');
    expect(await router.navigateByUrl('/other', { state: LEAVING_UNSAVED })).toBeTrue();
    expect(document.querySelector('mat-dialog-container')).toBeNull();
  });

  it('has the browser ask before the tab is closed or reloaded, only while work is unsaved', () => {
    const listen = spyOn(window, 'addEventListener');
    const work = TestBed.runInInjectionContext(() => new UnsavedWork());
    expect(listen).toHaveBeenCalledWith('beforeunload', work.beforeUnload);

    expect(unload().defaultPrevented).toBeFalse();
    typeNote('Half a note');
    expect(unload().defaultPrevented).toBeTrue();
  });
});
