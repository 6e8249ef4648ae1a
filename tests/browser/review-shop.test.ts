import pg from 'pg';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { WindingSheet } from '@shared/shop/sheet';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { testConfig } from '../api/support/test-app.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 120_000);
afterAll(() => h?.close());

const user = (username: string) => DEMO_USERS.find((u) => u.username === username)!;

/** A feasible seeded draft of the demo engineer, saved the way the design workspace saves it. */
async function seededDraftRevision(): Promise<{ revisionId: number; designNumber: string }> {
  const pool = new pg.Pool({ connectionString: testConfig({}).databaseUrl, max: 1 });
  try {
    const { rows } = await pool.query<{ id: number; number: string }>(
      `select r.id, d.number from design_revisions r
         join designs d on d.id = r.design_id
         join users u on u.id = d.owner_id
        where u.username = 'erin' and r.status = 'draft' and (r.result -> 'evaluation' ->> 'feasible') = 'true'
        order by d.id limit 1`,
    );
    if (!rows[0]) throw new Error('the demo seed has no feasible draft for erin');
    return { revisionId: rows[0].id, designNumber: rows[0].number };
  } finally {
    await pool.end();
  }
}

async function expectNoSeriousAxeFindings(page: Page): Promise<void> {
  expect(await seriousAxeFindings(page)).toEqual([]);
}

async function confirmDialog(page: Page, fill?: (dialog: ReturnType<Page['getByRole']>) => Promise<void>): Promise<void> {
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  await expectNoSeriousAxeFindings(page);
  if (fill) await fill(dialog);
  await dialog.locator('button[type="submit"]').click();
  await dialog.waitFor({ state: 'detached' });
}

describe('review, release and the winding shop', () => {
  it('takes a design from submission to two built units and the measured-versus-predicted report', async () => {
    const { revisionId, designNumber } = await seededDraftRevision();

    // The engineer submits the draft.
    const engineer = await h.newPage();
    await signIn(engineer.page, user('erin').username, user('erin').password);
    await engineer.page.goto(`/review/revisions/${revisionId}`);
    await engineer.page.getByRole('heading', { level: 1, name: new RegExp(designNumber) }).waitFor();
    await expectNoSeriousAxeFindings(engineer.page);
    await engineer.page.getByRole('button', { name: 'Submit for review' }).click();
    await confirmDialog(engineer.page, (d) => d.getByLabel('Comment (optional)').fill('Ready for a look'));
    await engineer.page.getByText('Submitted for review', { exact: true }).waitFor();
    await engineer.page.getByText('Ready for a look').waitFor();
    expect(await engineer.page.getByRole('button', { name: 'Submit for review' }).count()).toBe(0);
    await engineer.page.screenshot({ path: screenshotPath('review-submitted'), fullPage: true });

    // The reviewer sees it waiting, approves and releases two.
    const reviewer = await h.newPage();
    await signIn(reviewer.page, user('ruth').username, user('ruth').password);
    await reviewer.page.getByRole('link', { name: /^Waiting for me: [1-9]/ }).click();
    await reviewer.page.waitForURL(/\/inbox$/);
    await reviewer.page.getByRole('link', { name: new RegExp(`Review ${designNumber}`) }).waitFor();
    await expectNoSeriousAxeFindings(reviewer.page);
    await reviewer.page.screenshot({ path: screenshotPath('review-inbox'), fullPage: true });

    await reviewer.page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Review' }).click();
    const card = reviewer.page.locator('mat-card', { hasText: designNumber });
    await card.getByRole('button', { name: 'Approve' }).waitFor();
    await expectNoSeriousAxeFindings(reviewer.page);
    await card.getByRole('button', { name: 'Approve' }).click();
    await confirmDialog(reviewer.page, (d) => d.getByLabel('Comment (optional)').fill('Margins fine'));
    await card.getByRole('button', { name: 'Release' }).waitFor();
    await card.getByRole('button', { name: 'Release' }).click();
    await confirmDialog(reviewer.page, async (d) => {
      const quantity = d.getByLabel('Quantity to build');
      await quantity.fill('0');
      await quantity.blur();
      await d.getByText('Quantity must be a whole number between 1 and 100000').waitFor();
      await quantity.fill('2');
    });
    await reviewer.page.getByText(/build order BO-\d{4} sent to the winding shop/).waitFor();
    await reviewer.page.screenshot({ path: screenshotPath('review-released'), fullPage: true });

    // The admin sees the hand-off mail with the PDF.
    const admin = await h.newPage();
    await signIn(admin.page, user('ada').username, user('ada').password);
    await admin.page.goto('/admin/outbox');
    const mail = admin.page.locator('mat-expansion-panel', { hasText: new RegExp(`Build order BO-\\d{4}: ${designNumber}`) });
    const sent = admin.page.locator('.gw-delivery-state[data-state="sent"]');
    // Delivery runs after the release has committed; refresh until the fake server has the message.
    for (let attempt = 0; attempt < 20 && ((await mail.count()) === 0 || (await sent.count()) === 0); attempt++) {
      await admin.page.waitForTimeout(500);
      await admin.page.getByRole('button', { name: 'Refresh' }).click();
    }
    await mail.waitFor();
    await sent.first().waitFor();
    await mail.locator('mat-expansion-panel-header').click();
    const pdfLink = mail.getByRole('link', { name: /winding-sheet\.pdf/ });
    await pdfLink.waitFor();
    const pdf = await admin.page.request.get((await pdfLink.getAttribute('href'))!);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await expectNoSeriousAxeFindings(admin.page);
    await admin.page.screenshot({ path: screenshotPath('review-outbox'), fullPage: true });
    await admin.page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Settings' }).click();
    await admin.page.getByLabel('Shop e-mail address').waitFor();
    await expectNoSeriousAxeFindings(admin.page);
    await admin.page.screenshot({ path: screenshotPath('review-settings'), fullPage: true });

    // The winder opens the order, prints the sheet and records a passing and a failing unit.
    const winder = await h.newPage();
    await signIn(winder.page, user('wendell').username, user('wendell').password);
    await winder.page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Winding shop' }).click();
    const orderLink = winder.page.getByRole('link', { name: /^BO-\d{4}$/ }).first();
    await orderLink.waitFor();
    await expectNoSeriousAxeFindings(winder.page);
    await winder.page.screenshot({ path: screenshotPath('shop-queue'), fullPage: true });
    await orderLink.click();
    await winder.page.waitForURL(/\/shop\/orders\/\d+$/);
    const orderId = Number(new URL(winder.page.url()).pathname.split('/').at(-1));
    await winder.page.getByRole('heading', { name: new RegExp(`Winding sheet — ${designNumber}`) }).waitFor();
    await winder.page.getByRole('note', { name: 'Caution' }).waitFor();
    await winder.page.getByRole('heading', { name: 'Tests and limits' }).waitFor();
    await winder.page.getByRole('link', { name: 'Download PDF' }).waitFor();
    await expectNoSeriousAxeFindings(winder.page);
    await winder.page.screenshot({ path: screenshotPath('shop-order'), fullPage: true });
    await winder.page.emulateMedia({ media: 'print' });
    expect(await winder.page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await winder.page.getByRole('navigation', { name: 'Main navigation' }).isVisible()).toBe(false);
    await winder.page.screenshot({ path: screenshotPath('shop-sheet-print'), fullPage: true });
    await winder.page.emulateMedia({ media: 'screen' });
    // The side navigation measured itself while hidden for print; a fresh load lays the screen out again.
    await winder.page.reload();
    await winder.page.getByRole('button', { name: 'Record unit' }).waitFor();

    const order = (await (await winder.page.request.get(`/api/shop/orders/${orderId}`)).json()) as { sheet: WindingSheet };
    const limits = order.sheet.tests;
    const typeInto = async (label: string, text: string) => {
      const field = winder.page.getByRole('textbox', { name: label });
      await field.fill(text);
      await field.blur();
    };
    const recordUnit = async (inductanceMicrohenry: number, resistanceMilliohm: number) => {
      await typeInto('Measured inductance', `${inductanceMicrohenry.toPrecision(4)} uH`);
      await typeInto('DC resistance', `${resistanceMilliohm.toPrecision(4)} mOhm`);
      await typeInto('Temperature at the DCR reading', '20 °C');
      // Where the sheet asks for L under DC bias, the unit shows the predicted L at that current (filled in by the form).
      if (limits.biasInductance) await typeInto('L under DC bias', `${(limits.biasInductance.predicted * 1e6).toPrecision(4)} uH`);
      await winder.page.getByRole('combobox', { name: 'Hipot' }).click();
      await winder.page.getByRole('option', { name: 'Pass' }).click();
      await winder.page.getByRole('button', { name: 'Record unit' }).click();
    };
    await recordUnit(limits.inductance.nominal * 1e6, limits.resistanceMax20 * 0.9 * 1e3);
    await winder.page.locator('tr.mat-mdc-row', { hasText: 'Pass' }).first().waitFor();
    // Half the nominal inductance is outside any sheet tolerance: this unit fails.
    await recordUnit(limits.inductance.nominal * 0.5 * 1e6, limits.resistanceMax20 * 0.9 * 1e3);
    const failing = winder.page.locator('tr.mat-mdc-row', { hasText: '✗ L =' });
    await failing.waitFor();
    expect(await winder.page.locator('tr.mat-mdc-row').count()).toBe(2);
    expect(await winder.page.getByText('1 passed of 2 built').count()).toBe(1);

    // The winder voids the failing record with a reason and records unit 2 again (failing again, for the report).
    await winder.page.getByRole('button', { name: 'Void the record of unit 2' }).click();
    await confirmDialog(winder.page, (d) => d.getByLabel('Reason').fill('Read with the meter leads not nulled'));
    await winder.page.locator('tr.gw-voided', { hasText: 'Read with the meter leads not nulled' }).waitFor();
    await winder.page.getByText('1 passed of 1 built').waitFor();
    await winder.page.getByRole('button', { name: 'Unit 2' }).click();
    await recordUnit(limits.inductance.nominal * 0.5 * 1e6, limits.resistanceMax20 * 0.9 * 1e3);
    await winder.page.getByText('1 passed of 2 built').waitFor();
    expect(await winder.page.locator('tr.mat-mdc-row').count()).toBe(3);
    await expectNoSeriousAxeFindings(winder.page);
    await winder.page.screenshot({ path: screenshotPath('shop-units'), fullPage: true });

    // The engineer compares measured with predicted.
    await engineer.page.goto('/shop/accuracy');
    await engineer.page.locator('tr.mat-mdc-row', { hasText: designNumber }).nth(1).waitFor();
    await engineer.page.locator('canvas').first().waitFor();
    await engineer.page.getByRole('heading', { name: 'By material' }).waitFor();
    // Unit 1 was entered at the predicted nominal inductance, unit 2 at half of it; the voided record is left out.
    const lRatios = await engineer.page.locator('tr.mat-mdc-row', { hasText: designNumber }).allInnerTexts();
    expect(lRatios).toHaveLength(2);
    expect(lRatios.some((row) => row.includes('1.000'))).toBe(true);
    expect(lRatios.some((row) => row.includes('0.500'))).toBe(true);
    await expectNoSeriousAxeFindings(engineer.page);
    await engineer.page.screenshot({ path: screenshotPath('shop-accuracy'), fullPage: true });

    for (const each of [engineer, reviewer, admin, winder]) await each.context.close();
  }, 180_000);
});
