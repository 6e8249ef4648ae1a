import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designRevisions, materials } from '../../server/db/schema.ts';
import { MIGRATIONS_FOLDER } from '../../server/db/migrate.ts';
import { DEMO_MATERIALS } from '../../server/seed/demo-materials.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Migration 0009 gives the demo materials neutral names. The test database is already migrated and seeded with the
// new names, so each case first puts rows back in the old state, then runs the migration's SQL again.

const RENAME = readFileSync(join(MIGRATIONS_FOLDER, '0009_neutral_demo_names.sql'), 'utf8');
const OLD = { lineage: 'demo-ferrite-mf-95-illustrative', name: 'Demo ferrite MF-95 (illustrative)' };
const NEW = { lineage: 'demo-ferrite-amber-illustrative', name: 'Demo ferrite Amber (illustrative)' };

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const rowsOf = (lineage: string) => t.db.select().from(materials).where(eq(materials.lineage, lineage));

describe('neutral demo material names', () => {
  it('no demo name echoes a grade or permeability designation (letters and digits like "MF-95" or "P-26")', () => {
    for (const m of DEMO_MATERIALS) expect(m.name).not.toMatch(/\b[A-Z]{1,3}-?\d{2,3}\b/);
  });

  it('renames every version of an old demo lineage in place, so designs keep pointing at the same rows', async () => {
    const [amber] = await rowsOf(NEW.lineage);
    expect(amber).toBeDefined();
    // A second version a user renamed keeps the user's name.
    await t.db.insert(materials).values({ ...amber!, id: undefined, version: 2, current: false, name: 'Amber as re-measured' });
    const pointing = await t.db.select({ id: designRevisions.id }).from(designRevisions).where(eq(designRevisions.materialId, amber!.id));
    await t.db.update(materials).set({ lineage: OLD.lineage }).where(eq(materials.lineage, NEW.lineage));
    await t.db.update(materials).set({ name: OLD.name }).where(eq(materials.id, amber!.id));

    await t.db.execute(sql.raw(RENAME));

    const after = (await rowsOf(NEW.lineage)).sort((a, b) => a.version - b.version);
    expect(after.map((r) => [r.id, r.name])).toEqual([
      [amber!.id, NEW.name],
      [after[1]!.id, 'Amber as re-measured'],
    ]);
    expect(await rowsOf(OLD.lineage)).toEqual([]);
    const stillPointing = await t.db
      .select({ id: designRevisions.id })
      .from(designRevisions)
      .where(eq(designRevisions.materialId, amber!.id));
    expect(stillPointing).toEqual(pointing);
  });

  it('leaves an old lineage alone when a current material already has the new name', async () => {
    await t.db.update(materials).set({ lineage: OLD.lineage, name: OLD.name }).where(eq(materials.lineage, NEW.lineage));
    const [taken] = await t.db
      .insert(materials)
      .values({
        ...(await rowsOf(OLD.lineage))[0]!,
        id: undefined,
        lineage: 'a-user-s-own',
        version: 1,
        current: true,
        name: 'demo ferrite amber (ILLUSTRATIVE)',
      })
      .returning();

    await t.db.execute(sql.raw(RENAME));

    expect((await rowsOf(OLD.lineage)).length).toBeGreaterThan(0);
    expect((await rowsOf(NEW.lineage)).length).toBe(0);
    await t.db.delete(materials).where(eq(materials.id, taken!.id));
  });
});
