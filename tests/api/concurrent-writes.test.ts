import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materials, userCores, users } from '../../server/db/schema.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// Four requests writing the same thing at the same moment: one wins, the others hear 409 in the one error
// shape with a message saying what clashed; never a 500, never two versions with the same number.

let t: TestApp;
let engineer: ApiClient;
let admin: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  [engineer, admin] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'admin')]);
});
afterAll(() => t.close());

const statuses = (answers: { status: number }[]) => answers.map((a) => a.status).sort();

/** Version numbers of a lineage, and how many of its rows are current. */
function versionsOf(rows: { version: number; current: boolean }[]) {
  return { versions: rows.map((r) => r.version).sort(), current: rows.filter((r) => r.current).length };
}

describe('four parallel writes of one thing', () => {
  it('edits of one material: one new version, three 409s naming the material changed meanwhile', async () => {
    const list = (await engineer.get('/api/materials/library')).body.materials as {
      id: number;
      name: string;
      version: number;
      lineage?: string;
    }[];
    const target = list.find((m) => m.name.startsWith('Demo ferrite Amber'))!;
    const answers = await Promise.all([1.41, 1.42, 1.43, 1.44].map((alpha) => engineer.patch(`/api/materials/${target.id}`, { alpha })));
    expect(statuses(answers)).toEqual([201, 409, 409, 409]);
    // An edit that waited for the winner's row lock hears that another version was saved at the same moment;
    // one that started after the winner's commit, that only the current version can be edited.
    for (const refused of answers.filter((a) => a.status === 409)) {
      expect(refused.body.error.code).toBe('conflict');
      expect(refused.body.error.message).toMatch(/version of (this|a) material/);
    }
    const [row] = await t.db.select().from(materials).where(eq(materials.id, target.id));
    expect(versionsOf(await t.db.select().from(materials).where(eq(materials.lineage, row.lineage)))).toEqual({
      versions: [1, 2],
      current: 1,
    });
  });

  it('edits of one user core: one new version, three 409s', async () => {
    const ring = {
      kind: 'ring',
      name: 'Parallel ring 20/10/7',
      family: 'POWDER_TOROID',
      outerDiameter: 20e-3,
      innerDiameter: 10e-3,
      height: 7e-3,
      source: 'our own sample',
    };
    const created = await engineer.post('/api/catalogue/cores', ring);
    expect(created.status).toBe(201);
    const id = created.body.userCoreId as number;
    const answers = await Promise.all(
      [8, 9, 10, 11].map((mm) => engineer.put(`/api/catalogue/cores/${id}`, { ...ring, height: mm * 1e-3 })),
    );
    expect(statuses(answers)).toEqual([201, 409, 409, 409]);
    for (const refused of answers.filter((a) => a.status === 409)) {
      expect(refused.body.error.code).toBe('conflict');
      expect(refused.body.error.message).toMatch(/version of (this|a) core/);
    }
    const [row] = await t.db.select().from(userCores).where(eq(userCores.id, id));
    expect(versionsOf(await t.db.select().from(userCores).where(eq(userCores.lineage, row.lineage)))).toEqual({
      versions: [1, 2],
      current: 1,
    });
  });

  it('creations of one user core name: one core, three 409s naming the name', async () => {
    const ring = (height: number) => ({
      kind: 'ring',
      name: 'Parallel new ring',
      family: 'RING',
      outerDiameter: 20e-3,
      innerDiameter: 10e-3,
      height: height * 1e-3,
      source: 'our own sample',
    });
    const answers = await Promise.all([7, 8, 9, 10].map((mm) => engineer.post('/api/catalogue/cores', ring(mm))));
    expect(statuses(answers)).toEqual([201, 409, 409, 409]);
    for (const refused of answers.filter((a) => a.status === 409)) {
      expect(refused.body.error.code).toBe('conflict');
      expect(refused.body.error.fields).toHaveProperty('name');
    }
    expect(await t.db.select().from(userCores).where(eq(userCores.name, 'Parallel new ring'))).toHaveLength(1);
  });

  it('the database itself refuses two current user cores of one name (any case)', async () => {
    const [core] = await t.db.select().from(userCores).where(eq(userCores.name, 'Parallel new ring'));
    const copy = { ...core!, id: undefined, createdAt: undefined, lineage: 'another-lineage', name: 'PARALLEL NEW RING' };
    await expect(t.db.insert(userCores).values(copy)).rejects.toMatchObject({ cause: { constraint: 'user_cores_current_name_idx' } });
    // A version that is no longer current may keep the name.
    await t.db.insert(userCores).values({ ...copy, current: false });
  });

  it('creations of one username by the admin: one account, three 409s naming the username', async () => {
    const answers = await Promise.all(
      ['Quinn A', 'Quinn B', 'Quinn C', 'Quinn D'].map((displayName) =>
        admin.post('/api/admin/users', { username: 'quinn', displayName, role: 'winder', password: 'a long passphrase' }),
      ),
    );
    expect(statuses(answers)).toEqual([201, 409, 409, 409]);
    for (const refused of answers.filter((a) => a.status === 409)) {
      expect(refused.body.error.code).toBe('conflict');
      expect(refused.body.error.message).toMatch(/"quinn" is taken/);
      expect(refused.body.error.fields).toHaveProperty('username');
    }
    expect(await t.db.select().from(users).where(eq(users.username, 'quinn'))).toHaveLength(1);
  });
});
