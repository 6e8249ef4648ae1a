import { describe, expect, it } from 'vitest';
import { transitionRequestSchema } from '@shared/schemas/review';
import { designListQuerySchema } from '@shared/schemas/designs';
import { isStorableText, text } from '@shared/schemas/text';

describe('storable text', () => {
  it.each([
    ['plain', 'go ahead', true],
    ['a surrogate pair (emoji)', 'ok 😀', true],
    ['a NUL', 'go \u0000', false],
    ['a lone high surrogate', 'go \ud800', false],
    ['a lone low surrogate', '\udc00 go', false],
    ['a high surrogate at the end of a pair run', '😀\ud83d', false],
  ])('%s → storable %s', (_name, value, storable) => {
    expect(isStorableText(value)).toBe(storable);
  });

  it('refuses before trimming and length checks, with one message', () => {
    const result = text().trim().min(1).max(3).safeParse(' \u0000 ');
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message)).toEqual([expect.stringMatching(/cannot be stored/)]);
  });

  it('is what the request schemas use, in bodies and query strings', () => {
    expect(transitionRequestSchema.safeParse({ comment: 'go \ud800' }).error?.issues[0].path).toEqual(['comment']);
    expect(designListQuerySchema.safeParse({ q: 'buck\u0000' }).error?.issues[0].path).toEqual(['q']);
  });
});
