import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';

import type { Role } from '@shared/api';
import { Session } from './session';
import { signInUrl } from './sign-in-url';

/** Lets any signed-in user through; sends everyone else to sign in first. */
export const requireSignIn: CanActivateFn = (_route, state) => inject(Session).user() !== null || signInUrl(inject(Router), state.url);

/**
 * Lets through a signed-in user who holds one of `allowed`. Anyone else signed in sees the
 * "not allowed" page, which names the roles that may open this one.
 */
export function requireRoles(allowed: readonly Role[]): CanActivateFn {
  return (_route, state) => {
    const session = inject(Session);
    const router = inject(Router);
    if (session.user() === null) {
      return signInUrl(router, state.url);
    }
    if (session.hasAnyRole(allowed)) {
      return true;
    }
    return router.createUrlTree(['/forbidden'], {
      queryParams: { page: state.url, roles: allowed.join(',') },
    });
  };
}
