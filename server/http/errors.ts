import type { ErrorRequestHandler, Request, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { databaseErrorAnswer } from './database-errors.ts';

export type FieldErrors = Record<string, string>;

/** An error the client should see as it is: status, a stable code and a plain message. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: FieldErrors) => new AppError(400, 'invalid_input', message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role may not do this.') => new AppError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message);
export const conflict = (message: string, fields?: FieldErrors) => new AppError(409, 'conflict', message, fields);

export function fieldErrorsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      // Name each field nobody asked for (mass assignment, typos) rather than the object holding it.
      for (const key of issue.keys) fields[[...issue.path, key].join('.')] ??= `Unknown field "${key}"`;
      continue;
    }
    const key = issue.path.length ? issue.path.join('.') : '(body)';
    fields[key] ??= issue.message;
  }
  return fields;
}

export function describeFieldErrors(fields: FieldErrors): string {
  const entries = Object.entries(fields);
  const shown = entries.slice(0, 3).map(([k, v]) => `${k}: ${v}`);
  const more = entries.length > 3 ? ` (and ${entries.length - 3} more)` : '';
  return `Invalid input. ${shown.join('; ')}${more}`;
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
};

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  code?: string;
  expose?: boolean;
}

/**
 * The one error shape: { error: { code, message, fields? } }. Never a stack trace. Every refusal
 * (401/403), wherever it was raised — a route guard or an ownership rule in a service — is reported
 * to `onRefused` so it reaches the audit log.
 */
export function errorMiddleware(
  log: (err: unknown, status: number) => void,
  onRefused: (req: Request, err: AppError) => Promise<void> | void = () => {},
): ErrorRequestHandler {
  return async (err, req, res, _next) => {
    let status = 500;
    let body: { code: string; message: string; fields?: FieldErrors };
    const h = err as HttpishError;
    const database = databaseErrorAnswer(err);
    if (err instanceof AppError) {
      status = err.status;
      body = { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) };
    } else if (err instanceof ZodError) {
      status = 400;
      const fields = fieldErrorsFromZod(err);
      body = { code: 'invalid_input', message: describeFieldErrors(fields), fields };
    } else if (h?.type === 'entity.parse.failed') {
      status = 400;
      body = { code: 'malformed_json', message: 'The request body is not valid JSON.' };
    } else if (h?.type === 'entity.too.large') {
      status = 413;
      body = { code: 'payload_too_large', message: 'The request body is too large.' };
    } else if (h?.code === 'EBADCSRFTOKEN') {
      status = 403;
      body = { code: 'csrf_failed', message: 'The request is missing its security token. Reload the page and try again.' };
    } else if (database) {
      ({ status, ...body } = database);
    } else if (typeof (h?.status ?? h?.statusCode) === 'number' && (h.status ?? h.statusCode)! < 500 && h.expose) {
      status = (h.status ?? h.statusCode)!;
      body = { code: 'bad_request', message: (err as Error).message };
    } else {
      body = { code: 'internal_error', message: 'Something went wrong on the server. It has been logged.' };
    }
    log(err, status);
    // The refusal is in the audit log before the caller hears of it (the recorder never throws).
    if (err instanceof AppError && (status === 401 || status === 403)) await onRefused(req, err);
    if (res.headersSent) return;
    res.status(status).json({ error: body });
  };
}
