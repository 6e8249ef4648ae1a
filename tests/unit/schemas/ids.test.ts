import { describe, expect, it } from 'vitest';
import { MAX_STORED_ID, storedIdSchema, storedIdTextSchema, uniqueListSchema } from '@shared/schemas/ids';

describe('stored ids', () => {
  it('accepts 1 to the largest PostgreSQL integer, as a number or as digits', () => {
    expect(storedIdSchema().safeParse(MAX_STORED_ID).success).toBe(true);
    expect(storedIdTextSchema().parse(' 2147483647 ')).toBe('2147483647');
    for (const bad of [0, -1, 1.5, MAX_STORED_ID + 1, Number.NaN]) expect(storedIdSchema().safeParse(bad).success).toBe(false);
    for (const bad of ['0', '01', '2147483648', '99999999999', '1e3', '0x10', '-1', '1; drop table users', '']) {
      expect(storedIdTextSchema().safeParse(bad).success, bad).toBe(false);
    }
  });
});

describe('lists in requests', () => {
  const list = uniqueListSchema(storedIdTextSchema(), 3, 'materialIds', 1);

  it('drops repeats, keeping the first order', () => {
    expect(list.parse(['5', '2', '5', '5', '2'])).toEqual(['5', '2']);
  });

  it('refuses more distinct values than the cap, naming it, and an empty list when one is required', () => {
    expect(list.safeParse(['1', '2', '3', '4']).error?.issues[0]?.message).toBe('materialIds may hold at most 3 distinct values');
    expect(list.safeParse(Array(31).fill('1')).error?.issues[0]?.message).toBe('materialIds may hold at most 3 distinct values');
    expect(list.safeParse([]).error?.issues[0]?.message).toBe('materialIds needs at least one value');
  });
});
