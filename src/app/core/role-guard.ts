import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import type { Role } from '@shared/schemas/auth';

import { Session } from './session';

/** Lets through only the given roles; others go home, signed-out people go to sign in. */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return (_route, state) => {
    const role = inject(Session).role();
    const router = inject(Router);
    if (role === null) return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
    return roles.includes(role) ? true : router.createUrlTree(['/']);
  };
}
