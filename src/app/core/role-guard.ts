import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { may, type Permission } from '@shared/api/permissions';

import { Session } from './session';

/** Lets through only the roles a permission of the shared table names; others go home, signed-out people go to sign in. */
export function roleGuard(permission: Permission): CanActivateFn {
  return (_route, state) => {
    const role = inject(Session).role();
    const router = inject(Router);
    if (role === null) return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
    return may(role, permission) ? true : router.createUrlTree(['/']);
  };
}
