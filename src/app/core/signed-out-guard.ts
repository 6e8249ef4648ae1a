import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';

import { Session } from './session';

/** The sign-in page is for signed-out visitors; someone already signed in goes home. */
export const signedOutGuard: CanActivateFn = () => (inject(Session).signedIn() ? inject(Router).createUrlTree(['/']) : true);
