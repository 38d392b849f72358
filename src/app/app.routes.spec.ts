import { EnvironmentInjector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, CanActivateFn, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';

import { signedInAs } from '../testing/signed-in-as';
import { routes } from './app.routes';
import { Role } from './core/user';

describe('app routes', () => {
  function open(path: string, role: Role): string | boolean {
    const guard = routes.find((r) => r.path === path)!.canActivate![0] as CanActivateFn;
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
});
