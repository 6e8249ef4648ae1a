import { HttpErrorResponse } from '@angular/common/http';
import * as z from 'zod';

// The server's single error shape: { error: { code, message, fields? } }.
const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorBodySchema>['error'];

export function apiErrorOf(error: unknown): ApiError | null {
  if (!(error instanceof HttpErrorResponse)) return null;
  const parsed = apiErrorBodySchema.safeParse(error.error);
  return parsed.success ? parsed.data.error : null;
}

/** A sentence a person can act on, preferring the server's own message. */
export function errorMessageOf(error: unknown): string {
  const apiError = apiErrorOf(error);
  if (apiError) return apiError.message;
  if (error instanceof HttpErrorResponse) {
    if (error.status === 0) return 'Cannot reach the Gapwright server. Check your connection and try again.';
    return `The server answered ${error.status} ${error.statusText}`.trim() + '.';
  }
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}
