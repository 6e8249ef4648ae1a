import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
const MATERIAL = 'Demo ferrite Slate (illustrative)';

describe('loss points of a material', () => {
  it('uploads points, refuses a typed bad point by row and column, fits, accepts, and finds the new version in the comparison', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/materials');
    await page.getByRole('link', { name: `Loss points of ${MATERIAL}`, exact: true }).click();
    await page.getByRole('heading', { name: 'Loss points', level: 1 }).waitFor();
    await page.getByText(`Version 1 of ${MATERIAL}: 0 points.`).waitFor();

    const template = await page.request.get('/api/materials/loss-points/template.csv');
    expect(template.status()).toBe(200);
    await page
      .getByLabel('Loss-point CSV file', { exact: true })
      .setInputFiles({ name: 'bench.csv', mimeType: 'text/csv', buffer: await template.body() });
    await page.getByText(/27 rows: 27 valid, 0 with problems; 3 frequencies, 3 flux levels, 3 temperatures/).waitFor();
    await page.getByRole('button', { name: 'Save as a new version with these points' }).click();
    await page.getByText(`Version 2 of ${MATERIAL}: 27 points.`).waitFor();
    expect(await page.locator('gw-loss-points-table tbody tr').count()).toBe(27);

    // A typed point with a negative loss is refused by the same check as a file, naming the row and column.
    await page.getByText('Or type and paste points').click();
    await page.getByLabel('Loss density (kW/m³), row 3', { exact: true }).fill('-5');
    await page.getByRole('button', { name: 'Check these points' }).click();
    await page.getByRole('heading', { name: 'Preview of the typed points' }).waitFor();
    const problems = page.getByRole('region', { name: 'Rows with problems, scrollable' });
    await problems.getByRole('cell', { name: '3', exact: true }).waitFor();
    expect(await problems.textContent()).toContain('loss_kw_per_m3');
    expect(await page.getByRole('button', { name: 'Save as a new version with these points' }).isDisabled()).toBe(true);
    await page.getByRole('button', { name: 'Cancel' }).click();
    await page.getByText('Or type and paste points').click();

    await page.getByRole('button', { name: 'Fit', exact: true }).click();
    const fitRow = page.locator('gw-fit-result tbody tr').first();
    await fitRow.waitFor();
    // The template's points come from k = 3.2, α = 1.4, β = 2.6 (its own invented coefficients), so the fit returns them.
    expect(await fitRow.textContent()).toMatch(/3\.2\d*\s*1\.400\s*2\.600/);
    await page.getByText(/Lowest loss at 90 °C/).waitFor();
    await page.locator('.gw-fit-chart canvas').waitFor();
    await page.waitForTimeout(1200);
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('loss-points-fit'), fullPage: true });

    await page.getByRole('button', { name: 'Accept as new version' }).click();
    await page.waitForURL(/\/materials$/);
    const row = page.getByRole('row').filter({ has: page.getByRole('cell', { name: MATERIAL, exact: true }) });
    await row.getByRole('cell', { name: 'v3', exact: true }).waitFor();

    await page.goto('/compare');
    await page.getByRole('heading', { name: 'Compare materials' }).waitFor();
    await page.getByRole('combobox', { name: 'Materials' }).click();
    const option = page.getByRole('option', { name: `${MATERIAL} (v3)` });
    await option.waitFor();
    if ((await option.getAttribute('aria-selected')) !== 'true') await option.click();
    await page.keyboard.press('Escape');
    await page.getByRole('button', { name: 'Draw curves' }).click();
    await page.locator('.gw-chart canvas').first().waitFor();
    await context.close();
  });
});
