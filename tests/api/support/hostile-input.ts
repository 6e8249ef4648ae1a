import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAs, type ApiClient } from './api-client.ts';
import { createTestApp, type TestApp } from './test-app.ts';

/** A converter spec every calculation route accepts; a case spoils one part of it. */
export const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

type Who = 'engineer' | 'admin' | 'winder' | 'anonymous';

export interface HostileCase {
  name: string;
  who: Who;
  method: 'get' | 'post' | 'patch' | 'put';
  url: string;
  body?: unknown;
  raw?: { type: string; data: string | Buffer };
  status: number | number[];
  /** A field the error must name, when the input has one. */
  field?: string;
}

/**
 * One test per case against a freshly seeded app: the expected status in the error shape, the field named,
 * no stack trace or source path in the answer, and every table's row count unchanged.
 */
export function describeHostileInput(title: string, cases: HostileCase[]): void {
  let t: TestApp;
  const clients = {} as Record<Who, ApiClient>;

  beforeAll(async () => {
    t = await createTestApp();
    const whos = ['engineer', 'admin', 'winder', 'anonymous'] as const;
    const signedIn = await Promise.all(whos.map((role) => signedInAs(t.app, role)));
    whos.forEach((who, i) => (clients[who] = signedIn[i]));
  });
  afterAll(() => t.close());

  /** Row counts of every table except the ones requests legitimately touch (sessions, the audit log). */
  async function rowCounts(): Promise<Record<string, number>> {
    const { rows } = await t.db.execute<{ table_name: string }>(
      sql`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not in ('session', 'audit_log')`,
    );
    const counts: Record<string, number> = {};
    for (const { table_name } of rows) {
      const r = await t.db.execute<{ n: number }>(sql`select count(*)::int as n from ${sql.identifier(table_name)}`);
      counts[table_name] = r.rows[0].n;
    }
    return counts;
  }

  describe(title, () => {
    it.each(cases)('$name → $status in the error shape, naming the field, with nothing written', async (c) => {
      const client = clients[c.who];
      const before = await rowCounts();
      let res;
      if (c.raw) {
        let req = client.agent[c.method](c.url).set('Content-Type', c.raw.type);
        if (c.method !== 'get') req = req.set('X-XSRF-TOKEN', client.csrfToken!);
        res = await req.send(c.raw.data as string);
      } else {
        res = await client.send(c.method, c.url, c.body);
      }
      expect([c.status].flat()).toContain(res.status);
      expect(res.body?.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
      if (c.field) expect(Object.keys(res.body.error.fields ?? {})).toContain(c.field);
      expect(res.text).not.toMatch(/\n\s+at |node_modules|\.ts:\d+:\d+/);
      expect(await rowCounts()).toEqual(before);
    });
  });
}
