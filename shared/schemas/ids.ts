// Ids and lists in requests. Every stored row has a PostgreSQL integer id (1 … 2 147 483 647): an id outside
// that range is refused at the edge with a 400 instead of reaching a query that would fail. Every list in a
// request is de-duplicated (the same id 200 times is one id) and capped, the refusal naming the cap.
import * as z from 'zod';

/** The largest value of a PostgreSQL `integer` column, so the largest id a row can have. */
export const MAX_STORED_ID = 2_147_483_647;

/** An id as a number (designId): a positive whole number no larger than the database integer range. */
export function storedIdSchema(what = 'id') {
  const message = `Not a ${what}: ids are whole numbers from 1 to ${MAX_STORED_ID}`;
  return z.number({ error: message }).int({ error: message }).min(1, { error: message }).max(MAX_STORED_ID, { error: message });
}

/** True when `text` is an id written in digits (no sign, no leading zero, nothing else) within the range. */
export function isStoredIdText(text: string): boolean {
  return /^[1-9]\d{0,9}$/.test(text) && Number(text) <= MAX_STORED_ID;
}

/** An id carried as text (material ids in the calculation and design APIs), with the same range. */
export function storedIdTextSchema(what = 'material id') {
  const message = `Not a ${what}: ids are whole numbers from 1 to ${MAX_STORED_ID}`;
  return z.string({ error: message }).trim().refine(isStoredIdText, { error: message });
}

/** The distinct values of a list, in the order they first appear. */
export function distinct<T>(values: readonly T[]): T[] {
  return [...new Set(values)];
}

/**
 * A list in a request: each item checked by `item`, repeats dropped, then at most `max` distinct items
 * ("at most 200 materialIds"). `min` distinct items are required when given.
 */
export function uniqueListSchema<T extends z.ZodType>(item: T, max: number, field: string, min = 0) {
  const tooMany = `${field} may hold at most ${max} distinct values`;
  return (
    z
      .array(item)
      // Repeats are dropped, but a list far longer than the cap is refused before every item is checked.
      .max(max * 10, { error: tooMany })
      .transform((values) => distinct(values))
      .refine((values) => values.length <= max, { error: tooMany })
      .refine((values) => values.length >= min, {
        error: min === 1 ? `${field} needs at least one value` : `${field} needs at least ${min} values`,
      })
  );
}
