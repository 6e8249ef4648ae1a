import { eq } from 'drizzle-orm';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { designRevisions, users } from '../../server/db/schema.ts';
import { insertEvaluatedDesign } from './support/design-fixture.ts';
import { uploadCsv } from './support/csv-import.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
let erin: ApiClient; // engineer, the author
let ruth: ApiClient; // reviewer
let ada: ApiClient; // admin

beforeAll(async () => {
  t = await createTestApp();
  [erin, ruth, ada] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'reviewer'), signedInAs(t.app, 'admin')]);
});
afterEach(() => vi.restoreAllMocks());
afterAll(() => t.close());

const statusOf = async (revisionId: number) =>
  (await t.db.select({ s: designRevisions.status }).from(designRevisions).where(eq(designRevisions.id, revisionId)))[0].s;

/** What a review step changes: the revision's status, its transitions, build orders, audit rows and queued mail. */
async function reviewState(revisionId: number) {
  return {
    status: await statusOf(revisionId),
    transitions: await tableCount(t.db, 'revision_transitions'),
    orders: await tableCount(t.db, 'build_orders'),
    audit: await tableCount(t.db, 'audit_log'),
    mail: await tableCount(t.db, 'mail_deliveries'),
  };
}

async function revisionIn(status: 'in_review' | 'approved') {
  const { revision } = await insertEvaluatedDesign(t, 'erin');
  expect((await erin.post(`/api/revisions/${revision.id}/submit`, {})).status).toBe(200);
  if (status === 'approved') expect((await ruth.post(`/api/revisions/${revision.id}/approve`, {})).status).toBe(200);
  return revision.id;
}

const UNSTORABLE = [
  { name: 'an unpaired surrogate', comment: 'go \ud800' },
  { name: 'a NUL', comment: 'go \u0000' },
];

const STEPS = [
  { step: 'approve', from: 'in_review', body: (comment: string) => ({ comment }) },
  { step: 'return', from: 'in_review', body: (comment: string) => ({ comment }) },
  { step: 'release', from: 'approved', body: (comment: string) => ({ quantity: 2, comment }) },
] as const;

describe('text the database cannot store is refused before anything changes', () => {
  for (const { step, from, body } of STEPS) {
    it.each(UNSTORABLE)(`${step} with $name in the comment → 400 naming comment, nothing changed`, async ({ comment }) => {
      const id = await revisionIn(from);
      const before = await reviewState(id);
      const res = await ruth.post(`/api/revisions/${id}/${step}`, body(comment));
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['comment']);
      expect(await reviewState(id)).toEqual(before);
      // Not half done: the same step with a clean comment still goes through (no 409).
      expect((await ruth.post(`/api/revisions/${id}/${step}`, body('go ahead'))).status).toBe(200);
    });
  }

  it.each(UNSTORABLE)('a display name with $name → 400 naming displayName, nothing changed', async ({ comment }) => {
    const [tomas] = await t.db.select().from(users).where(eq(users.username, 'tomas'));
    const audit = await tableCount(t.db, 'audit_log');
    const res = await ada.patch(`/api/admin/users/${tomas.id}`, { displayName: comment });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['displayName']);
    expect((await t.db.select().from(users).where(eq(users.id, tomas.id)))[0].displayName).toBe(tomas.displayName);
    expect(await tableCount(t.db, 'audit_log')).toBe(audit);
  });
});

describe('CSV uploads: the file name and the form fields are checked as well', () => {
  it.each([
    ['a NUL in the file name', 'mat\u0000.csv', {}, 'file'],
    ['an unpaired surrogate in a decision key', 'materials.csv', '{"MF\\ud800": "skip"}', 'decisions.MF\ud800'],
    ['__proto__ as a decision key', 'materials.csv', '{"__proto__": "skip"}', 'decisions.__proto__'],
  ])('%s → 400 naming it, nothing imported', async (_name, fileName, decisions, field) => {
    const template = (await erin.get('/api/materials/template.csv')).text;
    const before = {
      materials: await tableCount(t.db, 'materials'),
      imports: await tableCount(t.db, 'material_imports'),
      audit: await tableCount(t.db, 'audit_log'),
    };
    const res = await uploadCsv(erin, '/api/materials/import/commit', template, fileName, decisions);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
    expect({
      materials: await tableCount(t.db, 'materials'),
      imports: await tableCount(t.db, 'material_imports'),
      audit: await tableCount(t.db, 'audit_log'),
    }).toEqual(before);
  });
});

describe('an audit entry and its change commit together', () => {
  const auditFails = () => vi.spyOn(t.services.audit, 'record').mockRejectedValue(new Error('forced audit failure'));

  it.each(STEPS)('$step: a failing audit insert rolls the step back', async ({ step, from, body }) => {
    const id = await revisionIn(from);
    const before = await reviewState(id);
    auditFails();
    expect((await ruth.post(`/api/revisions/${id}/${step}`, body('fine'))).status).toBe(500);
    vi.restoreAllMocks();
    expect(await reviewState(id)).toEqual(before);
  });

  it('a display-name change: a failing audit insert leaves the name as it was', async () => {
    const [tomas] = await t.db.select().from(users).where(eq(users.username, 'tomas'));
    auditFails();
    expect((await ada.patch(`/api/admin/users/${tomas.id}`, { displayName: 'Tomas Renamed' })).status).toBe(500);
    vi.restoreAllMocks();
    expect((await t.db.select().from(users).where(eq(users.id, tomas.id)))[0].displayName).toBe(tomas.displayName);
  });
});
