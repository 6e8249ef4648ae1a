import type { RequestHandler } from 'express';
import { isStorableText, UNSTORABLE_TEXT_MESSAGE } from '@shared/schemas/text';
import { badRequest, type AppError } from './errors.ts';

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * The first problem in a parsed body or query: a string (value or key) PostgreSQL cannot store, or a key
 * that names an object's prototype machinery. Walked without recursion, so deep nesting cannot overflow.
 */
export function findUnsafeInput(root: unknown, prefix: string[] = []): AppError | null {
  const stack: { value: unknown; path: string[] }[] = [{ value: root, path: prefix }];
  while (stack.length) {
    const { value, path } = stack.pop()!;
    if (typeof value === 'string') {
      if (!isStorableText(value)) return refuse(path, UNSTORABLE_TEXT_MESSAGE);
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    for (const key of Object.keys(value).reverse()) {
      const at = [...path, key];
      if (FORBIDDEN_KEYS.has(key)) return refuse(at, `"${key}" is not allowed as a field name`);
      if (!isStorableText(key)) return refuse(at, `Field name: ${UNSTORABLE_TEXT_MESSAGE.toLowerCase()}`);
      stack.push({ value: (value as Record<string, unknown>)[key], path: at });
    }
  }
  return null;
}

function refuse(path: string[], message: string): AppError {
  const field = path.length ? path.join('.') : '(body)';
  return badRequest(`Invalid input. ${field}: ${message}`, { [field]: message });
}

/**
 * At the edge, before any route: every request's JSON body and query string are checked, so no free-text field
 * (schema-validated or not) can carry text the database would refuse halfway through a change.
 */
export const storableInput: RequestHandler = (req, _res, next) => {
  next(findUnsafeInput(req.body) ?? findUnsafeInput(req.query) ?? undefined);
};
