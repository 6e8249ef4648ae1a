import type { Request } from 'express';
import type { z } from 'zod';
import { badRequest, describeFieldErrors, fieldErrorsFromZod } from './errors.ts';

/** Parse a request part with a schema; a failure becomes a 400 naming each field. */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const fields = fieldErrorsFromZod(result.error);
    throw badRequest(describeFieldErrors(fields), fields);
  }
  return result.data;
}

// Express 5 leaves req.body undefined when no body was sent.
export const parseBody = <S extends z.ZodType>(schema: S, req: Request): z.infer<S> => parseWith(schema, req.body ?? {});
export const parseQuery = <S extends z.ZodType>(schema: S, req: Request): z.infer<S> => parseWith(schema, req.query);

export function parseIdParam(req: Request, name = 'id'): number {
  const raw = String(req.params[name] ?? '');
  // Digits only: "1e3", " 7" or "0x10" are not ids even though Number() would read them.
  const id = /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isInteger(id) || id > 2_147_483_647) {
    throw badRequest(`${name} must be a positive integer`, { [name]: 'Must be a positive integer' });
  }
  return id;
}
