import { EnvironmentInjector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import {
  ActivatedRouteSnapshot,
  CanActivateFn,
  Router,
  RouterStateSnapshot,
  UrlTree,
  provideRouter,
} from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Role } from './user';
import { homeGuard, roleGuard, signedOutGuard } from './role-guard';

describe('route guards', () => {
  function run(guard: CanActivateFn, role: Role | null, url = '/users'): string | boolean {
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({ providers: [provideRouter([]), signedInAs(role)] });
    const result = runInInjectionContext(TestBed.inject(EnvironmentInjector), () =>
      guard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot),
    );
    if (result instanceof UrlTree) {
      return TestBed.inject(Router).serializeUrl(result);
    }
    if (typeof result === 'boolean') {
      return result;
    }
    throw new Error('guards here answer at once');
  }

  it('lets the allowed role through', () => {
    expect(run(roleGuard('owner'), 'owner')).toBeTrue();
  });

  it('sends a signed-out person to sign in, keeping the wanted address', () => {
    expect(run(roleGuard('owner'), null, '/users/new')).toBe('/sign-in?returnUrl=%2Fusers%2Fnew');
  });

  it('sends another role to its own home instead', () => {
    expect(run(roleGuard('owner'), 'workroom')).toBe('/commissions');
    expect(run(roleGuard('owner', 'workroom'), 'client', '/clients')).toBe('/portal');
  });

  it('keeps signed-in people away from the sign-in page', () => {
    expect(run(signedOutGuard, 'client')).toBe('/portal');
    expect(run(signedOutGuard, null)).toBeTrue();
  });

  it('sends the bare address to the right first page', () => {
    expect(run(homeGuard, 'owner')).toBe('/overview');
    expect(run(homeGuard, 'workroom')).toBe('/commissions');
    expect(run(homeGuard, null)).toBe('/sign-in');
  });
});
