import { inArray, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appSettings, designRevisions } from '../../server/db/schema.ts';
import { seedDemoOnce } from '../../server/seed/seed-demo.ts';
import { signedInAs } from './support/api-client.ts';
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

  it('stores each demo design as a construction that evaluates to its stored part again (placement, spacer, keep-out)', async () => {
    // Before: a spacer design was stored with its magnetic-path total as a ground gap, so reopening it evaluated
    // another part (less inductance, every point of its frequency sweep not feasible).
    const erin = await signedInAs(t.app, 'engineer');
    const revisions = await t.db.select().from(designRevisions);
    const built = revisions.filter((r) => r.construction && r.result);
    expect(built.length).toBeGreaterThan(0);
    for (const revision of built) {
      const spec = revision.spec as { converter: unknown; limits?: unknown };
      const construction = revision.construction as Record<string, unknown>;
      const stored = (revision.result as { evaluation: { totalLoss: number; gap: { placement: string }; inductance: { nominal: number } } })
        .evaluation;
      const again = await erin.post('/api/calc/evaluate', { spec: spec.converter, limits: spec.limits, ...construction });
      expect(again.status).toBe(200);
      expect(again.body.result.gap.placement).toBe(stored.gap.placement);
      expect(again.body.result.inductance.nominal / stored.inductance.nominal).toBeCloseTo(1, 9);
      expect(again.body.result.totalLoss / stored.totalLoss).toBeCloseTo(1, 9);
    }
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
