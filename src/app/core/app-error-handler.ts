import { HttpErrorResponse } from '@angular/common/http';
import { ErrorHandler, Injectable, Injector, inject } from '@angular/core';

import { errorMessageOf } from './api-error';
import { Notifier } from './notifier';

/** Last stop for errors nobody handled: log them and tell the person. */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  // Resolved on first use: the snackbar's overlay depends on services that need the ErrorHandler.
  private readonly injector = inject(Injector);

  handleError(error: unknown): void {
    console.error(error);
    // The HTTP error interceptor has already shown failed requests.
    if (error instanceof HttpErrorResponse) return;
    this.injector.get(Notifier).error(`Something went wrong: ${errorMessageOf(error)}`);
  }
}
