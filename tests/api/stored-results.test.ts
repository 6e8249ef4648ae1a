import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildOrders, designRevisions } from '../../server/db/schema.ts';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { EXAMPLE_SPEC, insertEvaluatedDesign } from './support/design-fixture.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

// A revision keeps the engine's answer as JSON. One saved by an older version may no longer fit today's answer
// schemas; such a record is read as "no figures, and why", never cast and used.

let t: TestApp;
let erin: ApiClient;
let ruth: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  [erin, ruth] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'reviewer')]);
});
afterAll(() => t.close());

/** An evaluated draft of erin's whose saved figures have lost the thermal block, as an older version might have written them. */
async function designWithOldFigures(status: 'draft' | 'approved' = 'draft') {
  const { design, revision } = await insertEvaluatedDesign(t, 'erin');
  await t.db
    .update(designRevisions)
    // The fixture writes the converter flat; the designs API keeps it under `converter`.
    .set({ status, spec: { converter: EXAMPLE_SPEC }, result: sql`${designRevisions.result} #- '{evaluation,thermal}'` })
    .where(eq(designRevisions.id, revision.id));
  return { design, revision };
}

describe('saved figures that no longer read', () => {
  it('reads the design with the figures left out and the reason given; the construction stays', async () => {
    const { design } = await designWithOldFigures();
    const res = await erin.get(`/api/designs/${design.id}`);
    expect(res.status).toBe(200);
    expect(res.body.latest.result).toBeNull();
    expect(res.body.latest.resultUnreadable).toMatch(/^evaluation\.thermal: /);
    expect(res.body.latest.totalLoss).toBeNull();
    expect(res.body.latest.construction.coreId).toEqual(expect.any(String));
    expect((await erin.get(`/api/designs/${design.id}/diff?from=1&to=1`)).status).toBe(200);
  });

  it('refuses the files made from the figures with a 409 that says how to get them back', async () => {
    const { design } = await designWithOldFigures();
    for (const kind of ['bom.csv', 'spice.lib']) {
      const res = await erin.get(`/api/designs/${design.id}/revisions/1/exports/${kind}`);
      expect(res.status).toBe(409);
      expect(res.body.error.message).toMatch(/saved by an older version that no longer read \(evaluation\.thermal: .*save the draft again/);
    }
    expect((await erin.get(`/api/designs/${design.id}/revisions/1/exports/design.json`)).status).toBe(200);
  });

  it('refuses to submit the draft (409) until it is saved again, which evaluates it afresh', async () => {
    const { design, revision } = await designWithOldFigures();
    const refused = await erin.post(`/api/revisions/${revision.id}/submit`, {});
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields).toEqual({ result: 'Saved figures no longer read' });

    const saved = await erin.patch(`/api/designs/${design.id}/revisions/1`, { note: 'saved again' });
    expect(saved.status).toBe(200);
    expect(saved.body.resultUnreadable).toBeNull();
    expect(saved.body.result.evaluation.thermal.rise).toBeGreaterThan(0);
    expect((await erin.post(`/api/revisions/${revision.id}/submit`, {})).status).toBe(200);
  });

  it('refuses to release an approved revision whose figures no longer read, and builds no order', async () => {
    const { revision } = await designWithOldFigures('approved');
    const ordersBefore = await t.db.$count(buildOrders);
    const res = await ruth.post(`/api/revisions/${revision.id}/release`, { quantity: 2 });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/no longer read .*start a new revision from it/);
    expect(await t.db.$count(buildOrders)).toBe(ordersBefore);
    const [after] = await t.db.select().from(designRevisions).where(eq(designRevisions.id, revision.id));
    expect(after.status).toBe('approved');
  });
});
