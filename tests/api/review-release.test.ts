import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { predictedAtPins } from '@shared/shop/test-limits';
import { buildOrders, capturedMail, designRevisions, mailDeliveries } from '../../server/db/schema.ts';
import { addRevision, insertEvaluatedDesign } from './support/design-fixture.ts';
import { ApiClient, signedInAs } from './support/api-client.ts';
import { createTestApp, tableCount, type TestApp } from './support/test-app.ts';

let t: TestApp;
let erin: ApiClient; // engineer, the author
let tomas: ApiClient; // another engineer
let ruth: ApiClient; // reviewer
let wendell: ApiClient; // winder
let ada: ApiClient; // admin

beforeAll(async () => {
  t = await createTestApp();
  [erin, tomas, ruth, wendell, ada] = await Promise.all([
    signedInAs(t.app, 'engineer'),
    (async () => {
      const c = new ApiClient(t.app);
      await c.signIn('tomas', 'demo-engineer-2026');
      return c;
    })(),
    signedInAs(t.app, 'reviewer'),
    signedInAs(t.app, 'winder'),
    signedInAs(t.app, 'admin'),
  ]);
});
afterAll(() => t.close());

const statusOf = async (revisionId: number) =>
  (await t.db.select({ s: designRevisions.status }).from(designRevisions).where(eq(designRevisions.id, revisionId)))[0].s;

async function waitForMail(subjectPart: string, timeoutMs = 10_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const rows = await t.db.select().from(capturedMail);
    const hit = rows.find((r) => r.raw.includes(subjectPart));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no captured mail containing ${subjectPart}`);
}

describe('review and release', () => {
  it('walks draft → in review → approved → released, with each role allowed and refused where it should be', async () => {
    const { design, revision } = await insertEvaluatedDesign(t, 'erin');
    const id = revision.id;

    expect((await wendell.post(`/api/revisions/${id}/submit`, {})).status).toBe(403); // winders design nothing
    expect((await tomas.post(`/api/revisions/${id}/submit`, {})).status).toBe(403); // not the owner
    expect((await erin.post(`/api/revisions/${id}/approve`, {})).status).toBe(403); // engineers do not approve
    expect((await ruth.post(`/api/revisions/${id}/approve`, {})).status).toBe(409); // not submitted yet

    const submitted = await erin.post(`/api/revisions/${id}/submit`, { comment: 'Ready for a look' });
    expect(submitted.status).toBe(200);
    expect(await statusOf(id)).toBe('in_review');

    const inbox = await ruth.get('/api/inbox');
    expect(inbox.body.items.some((i: { kind: string; revisionId: number }) => i.kind === 'review' && i.revisionId === id)).toBe(true);

    expect((await ruth.post(`/api/revisions/${id}/approve`, { comment: 'Margins fine' })).status).toBe(200);
    expect(await statusOf(id)).toBe('approved');

    expect((await erin.post(`/api/revisions/${id}/release`, { quantity: 2 })).status).toBe(403);
    const bad = await ruth.post(`/api/revisions/${id}/release`, { quantity: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.quantity).toMatch(/between 1 and 100000/);

    const released = await ruth.post(`/api/revisions/${id}/release`, { quantity: 2 });
    expect(released.status).toBe(200);
    expect(released.body.orderNumber).toMatch(/^BO-\d{4}$/);
    expect(await statusOf(id)).toBe('released');

    // Nobody changes a released revision, whatever they try.
    for (const client of [erin, ruth, ada]) {
      for (const action of ['submit', 'approve', 'release']) {
        const res = await client.post(`/api/revisions/${id}/${action}`, action === 'release' ? { quantity: 1 } : {});
        expect([403, 409]).toContain(res.status);
      }
    }
    expect(await statusOf(id)).toBe('released');

    const timeline = await erin.get(`/api/revisions/${id}/timeline`);
    expect(timeline.body.entries.map((e: { toStatus: string }) => e.toStatus)).toEqual(['in_review', 'approved', 'released']);
    expect(timeline.body.entries[0]).toMatchObject({ actor: 'Erin Calder', comment: 'Ready for a look' });
    expect(timeline.body.designId).toBe(design.id);
  });

  it('does not let the author approve or release their own design, even as a reviewer', async () => {
    const { revision } = await insertEvaluatedDesign(t, 'ruth');
    expect((await ruth.post(`/api/revisions/${revision.id}/submit`, {})).status).toBe(200);
    const own = await ruth.post(`/api/revisions/${revision.id}/approve`, {});
    expect(own.status).toBe(403);
    expect(own.body.error.message).toMatch(/author/i);
    expect(await statusOf(revision.id)).toBe('in_review');
  });

  it('returns a design to draft with a required comment, and the author sees it waiting', async () => {
    const { revision } = await insertEvaluatedDesign(t, 'erin');
    await erin.post(`/api/revisions/${revision.id}/submit`, {});
    const empty = await ruth.post(`/api/revisions/${revision.id}/return`, { comment: '  ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.comment).toMatch(/what needs to change/);
    expect(
      (await ruth.post(`/api/revisions/${revision.id}/return`, { comment: 'Use a larger core: hot spot too close to class B' })).status,
    ).toBe(200);
    expect(await statusOf(revision.id)).toBe('draft');
    const inbox = await erin.get('/api/inbox');
    const item = inbox.body.items.find((i: { revisionId: number }) => i.revisionId === revision.id);
    expect(item).toMatchObject({ kind: 'returned' });
    expect(item.label).toMatch(/larger core/);
  });

  it('supersedes the earlier released revision when a new revision is released', async () => {
    const { design, revision } = await insertEvaluatedDesign(t, 'erin');
    for (const [client, action, body] of [
      [erin, 'submit', {}],
      [ruth, 'approve', {}],
      [ruth, 'release', { quantity: 1 }],
    ] as const) {
      expect((await client.post(`/api/revisions/${revision.id}/${action}`, body)).status).toBe(200);
    }
    const second = await addRevision(t, design.id, 2);
    for (const [client, action, body] of [
      [erin, 'submit', {}],
      [ruth, 'approve', {}],
      [ruth, 'release', { quantity: 1 }],
    ] as const) {
      expect((await client.post(`/api/revisions/${second.id}/${action}`, body)).status).toBe(200);
    }
    expect(await statusOf(revision.id)).toBe('superseded');
    expect(await statusOf(second.id)).toBe('released');
  });
});

describe('release hand-off to the winding shop', () => {
  let orderId: number;
  let orderNumber: string;
  let turns: number;
  let gapTotal: number;

  beforeAll(async () => {
    const { revision, result } = await insertEvaluatedDesign(t, 'erin');
    turns = result.turns;
    gapTotal = result.gap.total;
    await erin.post(`/api/revisions/${revision.id}/submit`, {});
    await ruth.post(`/api/revisions/${revision.id}/approve`, {});
    const released = await ruth.post(`/api/revisions/${revision.id}/release`, { quantity: 2 });
    orderId = released.body.orderId;
    orderNumber = released.body.orderNumber;
  });

  it('e-mails the shop with the winding sheet PDF attached, whose text gives the turns and the gap', async () => {
    const mail = await waitForMail(orderNumber);
    expect(mail.envelopeTo).toBe('shop@harrow-lane.example');
    const outbox = await ada.get('/api/admin/outbox');
    expect(outbox.status).toBe(200);
    const message = outbox.body.messages.find((m: { subject: string }) => m.subject.includes(orderNumber));
    expect(message.attachments).toHaveLength(1);
    expect(message.attachments[0].contentType).toBe('application/pdf');
    const pdf = await ada.getBytes(`/api/admin/outbox/${message.id}/attachments/1`);
    expect(pdf.status).toBe(200);
    const body = pdf.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    const dir = mkdtempSync(path.join(tmpdir(), 'gapwright-pdf-'));
    writeFileSync(path.join(dir, 'sheet.pdf'), body);
    // Kept as test artifacts: the PDF and its first page as a PNG.
    const results = process.env['TEST_RESULTS_DIR'] ?? path.resolve('test-results');
    mkdirSync(results, { recursive: true });
    writeFileSync(path.join(results, 'winding-sheet.pdf'), body);
    execFileSync('pdftoppm', [
      '-png',
      '-r',
      '80',
      '-f',
      '1',
      '-l',
      '1',
      '-singlefile',
      path.join(dir, 'sheet.pdf'),
      path.join(results, 'winding-sheet-page1'),
    ]);
    const text = execFileSync('pdftotext', ['-layout', path.join(dir, 'sheet.pdf'), '-'], { encoding: 'utf8' });
    expect(text).toContain(`${turns} turns`);
    expect(text).toContain(`${(gapTotal * 1e3).toPrecision(3).replace(/\.?0+$/, '')}`);
    expect(text).toMatch(/Engineering estimate/);
    expect(text).toMatch(/mΩ/); // the Greek letter comes through from the embedded Noto Sans subset
    const delivery = (await t.db.select().from(mailDeliveries).where(eq(mailDeliveries.orderId, orderId)))[0];
    expect(delivery.status).toBe('sent');
  });

  it('lets only the admin read the outbox', async () => {
    for (const client of [erin, ruth, wendell]) expect((await client.get('/api/admin/outbox')).status).toBe(403);
  });

  it('shows the winder the open order with its frozen sheet', async () => {
    const queue = await wendell.get('/api/shop/orders');
    expect(queue.body.orders.some((o: { id: number }) => o.id === orderId)).toBe(true);
    const order = await wendell.get(`/api/shop/orders/${orderId}`);
    expect(order.body.sheet.winding.turns).toBe(turns);
    expect(order.body.sheet.caution).toMatch(/qualified engineer/);
    const pdf = await wendell.get(`/api/shop/orders/${orderId}/sheet.pdf`);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-disposition']).toMatch(/attachment; filename="[A-Za-z0-9._-]+\.pdf"/);
  });

  it('says in the order whether the signed-in user may record units: the winder on the open order, not an engineer', async () => {
    expect((await wendell.get(`/api/shop/orders/${orderId}`)).body.canRecord).toBe(true);
    expect((await erin.get(`/api/shop/orders/${orderId}`)).body.canRecord).toBe(false);
    expect((await ruth.get(`/api/shop/orders/${orderId}`)).body.canRecord).toBe(false);
  });

  it('judges each unit against the sheet: DCR referred to 20 °C, inductance limits, completion at the quantity', async () => {
    const order = (await wendell.get(`/api/shop/orders/${orderId}`)).body;
    const limits = order.sheet.tests;
    // Measured at the pins: the winding with its leads and joints as the sheet predicts them.
    const r20 = predictedAtPins(limits.resistance);
    // A reading at 40 °C of a winding whose R20 is the prediction: R40 = R20·(1 + 0.00393·20)
    // (IEC 60028: ρ20 = 1.7241e-8 Ω·m; α20 = 0.00393 /K, IEC 60028 — from memory).
    const good = {
      inductance: limits.inductance.nominal,
      testFrequency: limits.inductance.testFrequency,
      resistance: r20 * (1 + 0.00393 * 20),
      resistanceTemperature: 40,
      hipot: 'not_tested',
      // Where the sheet asks for L under DC bias, the unit shows the predicted L at that current.
      ...(limits.biasInductance ? { biasCurrent: limits.biasInductance.current, biasInductance: limits.biasInductance.predicted } : {}),
    };

    expect((await erin.post(`/api/shop/orders/${orderId}/units`, good)).status).toBe(403); // only winders record

    const first = await wendell.post(`/api/shop/orders/${orderId}/units`, good);
    expect(first.status).toBe(201);
    expect(first.body.unit.passed).toBe(true);
    expect(first.body.unit.resistanceAt20).toBeCloseTo(r20, 9);
    expect(first.body.orderStatus).toBe('open');

    const low = await wendell.post(`/api/shop/orders/${orderId}/units`, {
      ...good,
      inductance: limits.inductance.min * 0.9,
      notes: 'gap ground too deep?',
    });
    expect(low.status).toBe(201);
    expect(low.body.unit.passed).toBe(false);
    const finding = low.body.unit.findings.find((f: { check: string }) => f.check === 'inductance');
    expect(finding.passed).toBe(false);

    const hot = await wendell.post(`/api/shop/orders/${orderId}/units`, {
      ...good,
      resistance: limits.resistanceMax20 * 1.2,
      resistanceTemperature: 20,
    });
    expect(hot.body.unit.passed).toBe(false);

    const second = await wendell.post(`/api/shop/orders/${orderId}/units`, good);
    expect(second.body.orderStatus).toBe('complete');
    const after = await wendell.post(`/api/shop/orders/${orderId}/units`, good);
    expect(after.status).toBe(409);
    expect((await wendell.get(`/api/shop/orders/${orderId}`)).body.canRecord).toBe(false); // complete
    expect((await wendell.get('/api/shop/orders')).body.orders.some((o: { id: number }) => o.id === orderId)).toBe(false);
  });

  it('refuses impossible measurements by field', async () => {
    const res = await wendell.post(`/api/shop/orders/${orderId}/units`, {
      inductance: -1,
      testFrequency: 1e4,
      resistance: 0.01,
      resistanceTemperature: 500,
      hipot: 'maybe',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['hipot', 'inductance', 'resistanceTemperature']);
  });

  it('reports measured against predicted with the error by material and by core', async () => {
    const report = await erin.get('/api/shop/prediction-report');
    expect(report.status).toBe(200);
    const units = report.body.units.filter((u: { orderNumber: string }) => u.orderNumber === orderNumber);
    expect(units).toHaveLength(4);
    expect(units[0].inductanceRatio).toBeCloseTo(1, 9);
    // compared at the pins, where the unit was measured: winding, leads and joints
    expect(units[0].resistanceRatio).toBeCloseTo(1, 9);
    expect(report.body.byMaterial.length).toBeGreaterThan(0);
    expect(report.body.byMaterial[0].inductanceRatio.spread).toBeGreaterThanOrEqual(0);
    expect((await wendell.get('/api/shop/prediction-report')).status).toBe(403);
  });

  it('voids a wrong record with a reason (recorder or reviewer only, audited, kept), and records the unit number again', async () => {
    const order = (await wendell.get(`/api/shop/orders/${orderId}`)).body;
    const [first, , hot] = order.units as { id: number; unitNumber: number; passed: boolean; canVoid: boolean }[];
    expect(first.passed).toBe(true);
    expect(first.canVoid).toBe(true); // its recorder
    expect((await erin.get(`/api/shop/orders/${orderId}`)).body.units[0].canVoid).toBe(false); // engineers do not void
    expect((await ruth.get(`/api/shop/orders/${orderId}`)).body.units[0].canVoid).toBe(true); // reviewers void any

    // Another winder may not void wendell's record; the refusal is audited.
    const created = await ada.post('/api/admin/users', {
      username: 'winder2',
      displayName: 'Second Winder',
      role: 'winder',
      password: 'second-winder-2026',
    });
    expect(created.status).toBe(201);
    const other = new ApiClient(t.app);
    await other.signIn('winder2', 'second-winder-2026');
    const refused = await other.post(`/api/shop/units/${first.id}/void`, { reason: 'not mine to void' });
    expect(refused.status).toBe(403);
    const denials = await t.pool.query("select 1 from audit_log where action = 'access.denied' and target = $1", [
      `POST /api/shop/units/${first.id}/void`,
    ]);
    expect(denials.rowCount).toBe(1);
    expect((await erin.post(`/api/shop/units/${first.id}/void`, { reason: 'engineer' })).status).toBe(403);

    // The reason is required, 3 to 500 characters; an unknown unit is a 404.
    const missing = await wendell.post(`/api/shop/units/${first.id}/void`, {});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(['reason']);
    expect((await wendell.post(`/api/shop/units/${first.id}/void`, { reason: 'ab' })).body.error.fields.reason).toMatch(/3 to 500/);
    expect((await wendell.post(`/api/shop/units/${first.id}/void`, { reason: 'x'.repeat(501) })).status).toBe(400);
    expect((await wendell.post('/api/shop/units/999999/void', { reason: 'no such unit' })).status).toBe(404);

    // The recorder voids a passing unit of the complete order: it opens again (one standing pass of two).
    const voided = await wendell.post(`/api/shop/units/${first.id}/void`, { reason: 'L read at 100 kHz by mistake' });
    expect(voided.status).toBe(200);
    expect(voided.body.unit.voidReason).toBe('L read at 100 kHz by mistake');
    expect(voided.body.unit.voidedAt).not.toBeNull();
    expect(voided.body.unit.canVoid).toBe(false);
    expect(voided.body.orderStatus).toBe('open');
    expect(voided.body.passedUnits).toBe(1);
    expect((await wendell.post(`/api/shop/units/${first.id}/void`, { reason: 'again' })).status).toBe(409);
    const audit = await t.pool.query<{ actor_id: number; target: string; details: { reason: string } }>(
      "select actor_id, target, details from audit_log where action = 'shop.unit_voided'",
    );
    expect(audit.rows).toHaveLength(1);
    expect(audit.rows[0].target).toBe(`${orderNumber} unit ${first.unitNumber}`);
    expect(audit.rows[0].details.reason).toBe('L read at 100 kHz by mistake');

    // Kept, never deleted; left out of the order's counts.
    const reopened = (await wendell.get(`/api/shop/orders/${orderId}`)).body;
    expect(reopened.units).toHaveLength(4);
    expect(reopened.canRecord).toBe(true);
    const summary = (await wendell.get('/api/shop/orders')).body.orders.find((o: { id: number }) => o.id === orderId);
    expect(summary).toMatchObject({ built: 3, passed: 1 });

    // A reviewer voids the winder's failing record too.
    expect((await ruth.post(`/api/shop/units/${hot.id}/void`, { reason: 'meter leads not nulled' })).status).toBe(200);

    // A unit number with a standing record cannot be recorded again; the voided one can.
    const good = {
      inductance: order.sheet.tests.inductance.nominal * 1.05,
      testFrequency: order.sheet.tests.inductance.testFrequency,
      resistance: order.sheet.predicted.resistance20,
      resistanceTemperature: 20,
      hipot: 'not_tested',
      ...(order.sheet.tests.biasInductance
        ? { biasCurrent: order.sheet.tests.biasInductance.current, biasInductance: order.sheet.tests.biasInductance.predicted }
        : {}),
    };
    const taken = await wendell.post(`/api/shop/orders/${orderId}/units`, { ...good, unitNumber: 2 });
    expect(taken.status).toBe(409);
    expect(Object.keys(taken.body.error.fields)).toEqual(['unitNumber']);
    const again = await wendell.post(`/api/shop/orders/${orderId}/units`, { ...good, unitNumber: first.unitNumber });
    expect(again.status).toBe(201);
    expect(again.body.unit.unitNumber).toBe(first.unitNumber);
    expect(again.body.unit.passed).toBe(true);
    expect(again.body.orderStatus).toBe('complete');

    // Measured against predicted leaves both voided records out: 4 recorded − 2 voided + 1 again.
    const report = await erin.get('/api/shop/prediction-report');
    const units = report.body.units.filter((u: { orderNumber: string }) => u.orderNumber === orderNumber);
    expect(units).toHaveLength(3);
    expect(units.filter((u: { inductanceRatio: number }) => Math.abs(u.inductanceRatio - 1.05) < 1e-9)).toHaveLength(1);
  });

  it('keeps the shop address as an admin setting', async () => {
    expect((await ruth.get('/api/admin/settings')).status).toBe(403);
    expect((await ada.put('/api/admin/settings', { shopEmail: 'not-an-address' })).status).toBe(400);
    const res = await ada.put('/api/admin/settings', { shopEmail: 'winding@harrow-lane.example' });
    expect(res.status).toBe(200);
    expect((await ada.get('/api/admin/settings')).body.shopEmail).toBe('winding@harrow-lane.example');
    await ada.put('/api/admin/settings', { shopEmail: 'shop@harrow-lane.example' });
  });
});

describe('a mail server that is down', () => {
  it('never blocks or undoes the release; the delivery is retried and then marked failed', async () => {
    // Its own job schema: the other test app of this file, whose mail server works, must not take the job.
    const offline = await createTestApp({
      MAIL_RETRY_DELAYS_MS: '20,20',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: '1',
      JOBS_SCHEMA: 'jobs_offline',
    });
    try {
      const { app } = offline;
      const test = offline;
      const author = await signedInAs(app, 'engineer');
      const reviewer = await signedInAs(app, 'reviewer');
      const { revision } = await insertEvaluatedDesign(test, 'erin');
      await author.post(`/api/revisions/${revision.id}/submit`, {});
      await reviewer.post(`/api/revisions/${revision.id}/approve`, {});
      const ordersBefore = await tableCount(offline.db, 'build_orders');
      const released = await reviewer.post(`/api/revisions/${revision.id}/release`, { quantity: 1 });
      expect(released.status).toBe(200);
      expect(await tableCount(offline.db, 'build_orders')).toBe(ordersBefore + 1);
      let delivery;
      for (let i = 0; i < 400; i++) {
        [delivery] = await offline.db.select().from(mailDeliveries).where(eq(mailDeliveries.orderId, released.body.orderId));
        if (delivery?.status === 'failed') break;
        await new Promise((r) => setTimeout(r, 50));
      }
      expect(delivery).toMatchObject({ status: 'failed', attempts: 3 });
      expect(delivery!.lastError).toMatch(/ECONNREFUSED|connect/i);
      const [order] = await offline.db.select().from(buildOrders).where(eq(buildOrders.id, released.body.orderId));
      expect(order.status).toBe('open');
    } finally {
      await offline.close();
    }
  });
});
