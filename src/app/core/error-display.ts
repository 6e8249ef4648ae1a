import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * Set on a request whose caller shows every failure itself (next to a form, say), so the
 * error interceptor neither opens a snackbar nor redirects on 401.
 */
export const ERRORS_SHOWN_BY_CALLER = new HttpContextToken<boolean>(() => false);

export function errorsShownByCaller(): { context: HttpContext } {
  return { context: new HttpContext().set(ERRORS_SHOWN_BY_CALLER, true) };
}
