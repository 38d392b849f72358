import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';

import { Auth } from './auth';
import { Role, homeFor } from './user';

/**
 * Lets a route open only for the given roles. Signed-out people go to the
 * sign-in page (keeping the wanted address); other roles go to their own home.
 * The server checks every request again: this only keeps the screens tidy.
 */
export function roleGuard(...allowed: Role[]): CanActivateFn {
  return (_route, state) => {
    const user = inject(Auth).user();
    const router = inject(Router);
    if (!user) {
      return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
    }
    if (allowed.includes(user.role)) {
      return true;
    }
    return router.parseUrl(homeFor(user.role));
  };
}

/** The sign-in page is for signed-out people; others go to their home. */
export const signedOutGuard: CanActivateFn = () => {
  const user = inject(Auth).user();
  return user ? inject(Router).parseUrl(homeFor(user.role)) : true;
};

/** The bare address sends each person to the right first page. */
export const homeGuard: CanActivateFn = () => {
  const user = inject(Auth).user();
  return inject(Router).parseUrl(user ? homeFor(user.role) : '/sign-in');
};
