import * as z from 'zod';

// U+0000 or a lone UTF-16 surrogate: PostgreSQL refuses both in text and in jsonb.
// eslint-disable-next-line no-control-regex -- finding control characters is the point of this pattern
const UNSTORABLE = /\u0000|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** True when PostgreSQL can store the string as text (no NUL, no unpaired surrogate). */
export function isStorableText(value: string): boolean {
  return !UNSTORABLE.test(value);
}

export const UNSTORABLE_TEXT_MESSAGE = 'Contains a character that cannot be stored (a NUL or an unpaired surrogate)';

/**
 * The string every request schema uses for a text field: `z.string()` plus the storable-text check, so a NUL
 * or a lone surrogate is a 400 naming the field instead of a database error after part of a change.
 */
export const text = (params?: Parameters<typeof z.string>[0]) =>
  z.string(params).refine(isStorableText, { error: UNSTORABLE_TEXT_MESSAGE, abort: true });
