import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { errorMessageOf } from './api-error';
import { ERRORS_SHOWN_BY_CALLER } from './error-display';
import { Notifier } from './notifier';
import { Session } from './session';

/** Tells the person about failed API calls, and sends them to sign in when the session is gone. */
export const httpErrorInterceptor: HttpInterceptorFn = (request, next) => {
  const notifier = inject(Notifier);
  const router = inject(Router);
  const session = inject(Session);

  return next(request).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse) || request.context.get(ERRORS_SHOWN_BY_CALLER)) {
        return throwError(() => error);
      }
      if (error.status === 401 && request.url.startsWith('/api/')) {
        session.clear();
        notifier.info('Your session has ended. Please sign in again.');
        void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
      } else {
        notifier.error(errorMessageOf(error));
      }
      return throwError(() => error);
    }),
  );
};
