import { HttpErrorResponse } from '@angular/common/http';

import { apiErrorOf, errorMessageOf } from '../core/api-error';

export function signInFailureMessage(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    if (error.status === 401) return apiErrorOf(error)?.message ?? 'Wrong username or password.';
    if (error.status === 429) return 'Too many attempts. Wait a few minutes, then try again.';
  }
  return errorMessageOf(error);
}
