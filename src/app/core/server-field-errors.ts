import type { FormGroup } from '@angular/forms';

import { apiErrorOf, errorMessageOf } from './api-error';

/**
 * Puts the server's per-field messages under the matching form fields (as the `server` error).
 * Returns the message to show under the form when no field could carry it, else null.
 */
export function showServerFieldErrors(form: FormGroup, error: unknown): string | null {
  const fields = apiErrorOf(error)?.fields ?? {};
  let shownOnAField = false;
  for (const [name, message] of Object.entries(fields)) {
    const control = form.get(name);
    if (!control) continue;
    control.setErrors({ server: message });
    control.markAsTouched();
    shownOnAField = true;
  }
  return shownOnAField ? null : errorMessageOf(error);
}
