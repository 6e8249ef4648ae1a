import { signal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import type { Observable } from 'rxjs';

export interface SubmissionHandlers<T> {
  /** The server accepted it. */
  done: (answer: T) => void;
  /** The words shown under the form for a failure (null: shown elsewhere, or under the fields). */
  describe: (error: unknown) => string | null;
  /** Keep the submit button disabled after success (a page that navigates away). */
  staysBusy?: boolean;
}

/** A form sent to the server: nothing is sent while a field is invalid; busy while it goes; the failure to show under it. */
export class FormSubmission {
  readonly submitting = signal(false);
  readonly failure = signal<string | null>(null);

  /** Sends when the form is valid, else marks every field touched so their messages show. */
  send<T>(form: AbstractControl, request: () => Observable<T>, { done, describe, staysBusy = false }: SubmissionHandlers<T>): void {
    if (form.invalid) {
      form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.failure.set(null);
    request().subscribe({
      next: (answer) => {
        this.submitting.set(staysBusy);
        done(answer);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.failure.set(describe(error));
      },
    });
  }
}
