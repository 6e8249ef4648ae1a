import * as z from 'zod';

/** A database id in a path: digits only ("1e3", " 7" or "0x10" are not ids), 1 … 2³¹−1. */
export const positiveIdSchema = z
  .string()
  .regex(/^[1-9][0-9]{0,9}$/, { error: 'Must be a positive integer' })
  .transform(Number)
  .refine((id) => id <= 2_147_483_647, { error: 'Must be a positive integer' });

/** `params` of a route with one `:id`. */
export const idParamsSchema = z.object({ id: positiveIdSchema });

/** `params` of a route with a design `:id` and a revision number `:rev`. */
export const revisionParamsSchema = z.object({ id: positiveIdSchema, rev: positiveIdSchema });
