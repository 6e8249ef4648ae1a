import { inArray, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appSettings } from '../../server/db/schema.ts';
import { seedDemoOnce } from '../../server/seed/seed-demo.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('the demo scenario', () => {
  it('is seeded whole on a new database: users, invented materials and three designs', async () => {
    expect(await tableCount(t.db, 'users')).toBe(5);
    expect(await tableCount(t.db, 'materials')).toBe(5);
    expect(await tableCount(t.db, 'designs')).toBe(3);
  });

  it('fills in the parts an installation seeded by an older version lacks, and never seeds twice', async () => {
    // An install from before materials and designs were part of the demo: users and the first marker only.
    await t.db.execute(sql`truncate table revision_transitions, design_revisions, designs, materials restart identity cascade`);
    await t.db.delete(appSettings).where(inArray(appSettings.key, ['demo_materials_seeded', 'demo_designs_seeded']));

    expect(await seedDemoOnce(t.db, 4)).toBe(true);
    expect(await tableCount(t.db, 'users')).toBe(5);
    expect(await tableCount(t.db, 'materials')).toBe(5);
    expect(await tableCount(t.db, 'designs')).toBe(3);

    expect(await seedDemoOnce(t.db, 4)).toBe(false);
    expect(await tableCount(t.db, 'materials')).toBe(5);
    expect(await tableCount(t.db, 'designs')).toBe(3);
  });
});
