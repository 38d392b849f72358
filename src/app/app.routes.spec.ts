import { EnvironmentInjector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, CanActivateFn, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { signedInAs } from '../testing/signed-in-as';
import { pages, routes } from './app.routes';
import { Role } from './core/user';

describe('app routes', () => {
  function open(path: string, role: Role | null): string | boolean {
    const guard = pages.find((r) => r.path === path)!.canActivate![0] as CanActivateFn;
    TestBed.configureTestingModule({ providers: [provideRouter([]), signedInAs(role)] });
    const result = runInInjectionContext(TestBed.inject(EnvironmentInjector), () =>
      guard({} as ActivatedRouteSnapshot, { url: `/${path}` } as RouterStateSnapshot),
    );
    return result instanceof UrlTree ? TestBed.inject(Router).serializeUrl(result) : (result as boolean);
  }

  it('opens studio fabric for the workroom, and sends a client to their portal', () => {
    expect(open('stock', 'workroom')).toBeTrue();
    TestBed.resetTestingModule();
    expect(open('stock', 'client')).toBe('/portal');
  });

  it('opens what is due for the owner and the workroom, and sends a client to their portal', () => {
    for (const role of ['owner', 'workroom'] as const) {
      expect(open('overview', role)).withContext(role).toBeTrue();
      TestBed.resetTestingModule();
    }
    expect(open('overview', 'client')).toBe('/portal');
  });

  it('opens the change-password page for anyone signed in, and asks others to sign in', () => {
    for (const role of ['owner', 'workroom', 'client'] as const) {
      expect(open('password', role)).withContext(role).toBeTrue();
      TestBed.resetTestingModule();
    }
    expect(open('password', null)).toMatch(/^\/sign-in/);
  });

  it('shows every page inside the shell, even at an address that leads nowhere', async () => {
    TestBed.configureTestingModule({ providers: [provideRouter(routes), signedInAs('owner')] });
    const harness = await RouterTestingHarness.create('/no-such-page');
    const root: HTMLElement = harness.fixture.nativeElement;
    expect(root.querySelector('ks-shell header mat-toolbar')).not.toBeNull();
    expect(root.querySelector('ks-shell main ks-not-found h1')?.textContent).toBe('Page not found');
  });
});
