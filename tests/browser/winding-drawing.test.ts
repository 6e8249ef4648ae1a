import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { testConfig } from '../api/support/test-app.ts';
import { apiWrite, apiWriteJson } from './support/page-api.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 120_000);
afterAll(() => h?.close());

const user = (username: string) => DEMO_USERS.find((u) => u.username === username)!;

/** The demo engineer's first feasible seeded draft. */
async function seededDraft(): Promise<{ revisionId: number; designId: number; designNumber: string }> {
  const pool = new pg.Pool({ connectionString: testConfig({}).databaseUrl, max: 1 });
  try {
    const { rows } = await pool.query<{ id: number; design_id: number; number: string }>(
      `select r.id, r.design_id, d.number from design_revisions r
         join designs d on d.id = r.design_id
         join users u on u.id = d.owner_id
        where u.username = 'erin' and r.status = 'draft' and (r.result -> 'evaluation' ->> 'feasible') = 'true'
        order by d.id limit 1`,
    );
    return { revisionId: rows[0].id, designId: rows[0].design_id, designNumber: rows[0].number };
  } finally {
    await pool.end();
  }
}

describe('the winding drawing', () => {
  it('is drawn on the design page and on the released winding sheet, on screen and in print', async () => {
    const { revisionId, designId, designNumber } = await seededDraft();

    // The design page draws the winding under its figures.
    const engineer = await h.newPage();
    await signIn(engineer.page, user('erin').username, user('erin').password);
    await engineer.page.goto(`/designs/${designId}`);
    const designDrawing = engineer.page.getByRole('img', { name: /^Winding section through one window, \d+ turns$/ });
    await designDrawing.waitFor();
    expect(await designDrawing.locator('circle').count()).toBeGreaterThan(0);
    await designDrawing.scrollIntoViewIfNeeded();
    await designDrawing.screenshot({ path: screenshotPath('design-winding-drawing') });

    // Released, the winder's sheet carries the same drawing.
    expect(await engineer.page.evaluate(apiWrite('POST', `/api/revisions/${revisionId}/submit`, {}))).toBe(200);
    const reviewer = await h.newPage();
    await signIn(reviewer.page, user('ruth').username, user('ruth').password);
    expect(await reviewer.page.evaluate(apiWrite('POST', `/api/revisions/${revisionId}/approve`, {}))).toBe(200);
    const released = (await reviewer.page.evaluate(apiWriteJson('POST', `/api/revisions/${revisionId}/release`, { quantity: 1 }))) as {
      orderId: number;
    };

    const winder = await h.newPage();
    await signIn(winder.page, user('wendell').username, user('wendell').password);
    await winder.page.goto(`/shop/orders/${released.orderId}`);
    await winder.page.getByRole('heading', { name: new RegExp(`Winding sheet — ${designNumber}`) }).waitFor();
    await winder.page.getByRole('heading', { name: 'Winding drawing' }).waitFor();
    const sheetDrawing = winder.page.getByRole('img', { name: /^Winding section through one window, \d+ turns$/ });
    await sheetDrawing.waitFor();
    const turns = Number(/(\d+) turns$/.exec((await sheetDrawing.getAttribute('aria-label'))!)![1]);
    // Every turn drawn (one circle per wire in hand), dimensions in mm, the keep-out hatched.
    expect((await sheetDrawing.locator('circle.r-copper').count()) % turns).toBe(0);
    expect(await sheetDrawing.locator('circle.r-copper').count()).toBeGreaterThanOrEqual(turns);
    expect(await sheetDrawing.locator('text', { hasText: /winding width [\d.]+ mm/ }).count()).toBe(1);
    expect(await sheetDrawing.locator('text', { hasText: /keep-out [\d.]+ mm/ }).count()).toBe(1);
    expect(await seriousAxeFindings(winder.page)).toEqual([]);
    await sheetDrawing.scrollIntoViewIfNeeded();
    await winder.page.screenshot({ path: screenshotPath('sheet-winding-drawing'), fullPage: true });
    await sheetDrawing.screenshot({ path: screenshotPath('sheet-winding-drawing-only') });

    // Dark theme: the drawing takes the theme's colours (copper filled, text readable).
    await winder.page.emulateMedia({ colorScheme: 'dark' });
    await sheetDrawing.screenshot({ path: screenshotPath('sheet-winding-drawing-dark') });

    // Printed: black on white.
    await winder.page.emulateMedia({ media: 'print', colorScheme: 'light' });
    const fill = await sheetDrawing
      .locator('text')
      .first()
      .evaluate((el) => getComputedStyle(el).fill);
    expect(fill).toBe('rgb(0, 0, 0)');
    await winder.page.screenshot({ path: screenshotPath('sheet-winding-drawing-print'), fullPage: true });
  });
});
