import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 120_000);
afterAll(() => h?.close());

const erin = DEMO_USERS.find((u) => u.username === 'erin')!;

describe('design workspace', () => {
  it('takes an engineer from a spec typed with units to a saved design and a SPICE file', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, erin.username, erin.password);

    await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Designs' }).click();
    await page
      .getByRole('cell', { name: /invented demo converter/ })
      .first()
      .waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('designs-list'), fullPage: true });

    await page.getByRole('link', { name: 'New design' }).click();
    await page.waitForURL(/\/designs\/new$/);
    const typeInto = async (label: string, text: string) => {
      const field = page.getByRole('textbox', { name: label, exact: true });
      await field.fill(text);
      await field.blur();
    };
    await typeInto('Vin min', '36 V');
    await typeInto('Vin max', '60V');
    await typeInto('Vout', '3 A');
    await page.getByText('Expected a voltage (V), not a current (A)').waitFor();
    await typeInto('Vout', '12 V');
    await typeInto('Iout max', '8 A');
    await typeInto('Switching frequency', '250kHz');
    expect(await page.getByRole('textbox', { name: 'Switching frequency', exact: true }).inputValue()).toBe('250 kHz');
    await typeInto('Current limit', '11 A');

    // L = Vout·(1 − Vout/Vin,max)/(fs·r·Iout) = 12·(1 − 12/60)/(250 kHz·0.3·8 A) = 16 µH (ideal CCM buck, volt-second balance, Erickson & Maksimović, Fundamentals of Power Electronics — from memory; computed).
    await page.locator('[data-figure="inductance"]', { hasText: '16 µH' }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('designs-spec'), fullPage: true });

    await page.getByRole('button', { name: 'Search candidates' }).click();
    const status = page.getByTestId('search-status');
    const rows = page.locator('[data-testid="candidates-table"] tr.mat-mdc-row');
    await status.filter({ hasText: /Candidates 1–20 of \d+, smallest part first/ }).waitFor({ timeout: 30_000 });
    const total = (await status.innerText()).match(/of ([\d,]+),/)![1];
    expect(Number(total.replace(',', ''))).toBeGreaterThan(100);
    expect(await status.innerText()).toMatch(/feasible of [\d,]+ evaluated \(\d+ cores × \d+ materials\) in \d+ ms\.$/);
    expect(await rows.count()).toBe(20);

    // At 1440 px a candidate takes at most two text lines: 2 × 18 px of 13 px text plus padding, well under 64 px.
    await page.setViewportSize({ width: 1440, height: 900 });
    const heights = await rows.evaluateAll((all) => all.map((row) => row.getBoundingClientRect().height));
    expect(Math.max(...heights)).toBeLessThanOrEqual(64);
    await page.screenshot({ path: screenshotPath('designs-candidates-1440') });

    // The objective ranks the whole list on the server: lowest loss first means the first rows' losses rise.
    await page.getByRole('radio', { name: 'Lowest loss' }).click();
    await status.filter({ hasText: /Candidates 1–20 of \d+, lowest loss first/ }).waitFor();
    await page.locator('caption', { hasText: 'Ranked lowest loss first' }).waitFor();
    const watts = (text: string) => Number(text.split(' ')[0]) * (text.endsWith(' mW') ? 1e-3 : 1);
    const losses = (await rows.locator('td.mat-column-totalLoss').allInnerTexts()).map(watts);
    expect(losses.slice(0, 5)).toEqual([...losses.slice(0, 5)].sort((a, b) => a - b));
    // The Volume header ranks by size again: the "smallest part" objective.
    await page.locator('th.mat-column-volume button').click();
    await status.filter({ hasText: /Candidates 1–20 of \d+, smallest part first/ }).waitFor();
    expect(await page.getByRole('radio', { name: 'Smallest part' }).isChecked()).toBe(true);

    // Paging asks the server for the next slice; the status line says which candidates are shown.
    await page.getByRole('button', { name: 'Next page' }).click();
    await status.filter({ hasText: `Candidates 21–40 of ${total}, smallest part first` }).waitFor();
    expect(await rows.first().locator('td').first().innerText()).toMatch(/^21\b/);
    // The page-size select sits under the paginator's touch target, which takes the click.
    await page.locator('gw-candidates-panel .mat-mdc-paginator-touch-target').click();
    await page.getByRole('option', { name: '50' }).click();
    await status.filter({ hasText: `Candidates 1–50 of ${total}` }).waitFor();
    expect(await rows.count()).toBe(50);

    // Candidates on extrapolated loss data follow the in-fit ones: the last page carries the mark, its text on focus.
    await page.getByRole('button', { name: 'Last page' }).click();
    await status.filter({ hasText: new RegExp(`Candidates [\\d,]+–${total} of ${total}`) }).waitFor();
    const mark = rows.last().getByRole('button', { name: 'Extrapolated loss data' });
    await rows.last().focus();
    await page.keyboard.press('Tab');
    expect(await mark.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.locator('.mat-mdc-tooltip', { hasText: /outside the .* fitted range/ }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.getByRole('button', { name: 'First page' }).click();
    await status.filter({ hasText: /Candidates 1–50 of/ }).waitFor();

    // Pick a point of the Pareto front on the chart itself.
    const point = page.locator('.gw-point').first();
    await point.waitFor();
    const pointLabel = (await point.innerText()).split(':')[0];
    const x = Number(await point.getAttribute('data-x'));
    const y = Number(await point.getAttribute('data-y'));
    const chart = page.locator('gw-candidates-panel [echarts]');
    await chart.click({ position: { x, y } });
    await page.getByTestId('selected-candidate').filter({ hasText: pointLabel }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('designs-candidates'), fullPage: true });
    await page.locator('gw-candidates-panel').screenshot({ path: screenshotPath('designs-candidates-panel') });
    await page.getByRole('button', { name: 'Use selected candidate' }).click();

    const totalLoss = page.locator('[data-figure="total-loss"]');
    await totalLoss.waitFor();
    const turnsField = page.getByRole('spinbutton', { name: 'Turns' });
    const turns = Number(await turnsField.inputValue());
    const lossBefore = await totalLoss.innerText();
    await turnsField.fill(String(turns + 4));
    await page.locator('[data-figure="turns"]', { hasText: String(turns + 4) }).waitFor();
    const lossAfter = await totalLoss.innerText();
    expect(lossAfter).not.toBe(lossBefore);
    const coreLossAfter = await page.locator('[data-figure="core-loss"]').innerText();

    await page.getByRole('textbox', { name: 'Title', exact: true }).fill('Browser test 48 V rail inductor');
    await page.getByRole('button', { name: 'Save as new design' }).click();
    await page.waitForURL(/\/designs\/\d+$/);
    await page.getByRole('heading', { level: 1, name: /GW-\d{4}/ }).waitFor();
    await page.locator('[data-figure="turns"]', { hasText: String(turns + 4) }).waitFor();
    expect(await totalLoss.innerText()).toBe(lossAfter);

    await page.reload();
    await page.locator('[data-figure="turns"]', { hasText: String(turns + 4) }).waitFor();
    expect(await totalLoss.innerText()).toBe(lossAfter);
    expect(await page.locator('[data-figure="core-loss"]').innerText()).toBe(coreLossAfter);
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('designs-design'), fullPage: true });
    await page.locator('gw-design-panel').screenshot({ path: screenshotPath('designs-design-panel') });

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'SPICE subcircuit' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^GW-\d{4}-r1\.lib$/);
    const spice = await readFile((await download.path())!, 'utf8');
    expect(spice).toMatch(/^\.SUBCKT GW_\d{4}_R1 1 2$/m);
    expect(spice).toMatch(/^\.ENDS GW_\d{4}_R1$/m);

    // Another core from the design page: the engine solves its turns and gap again.
    const coreBefore = (await page.locator('[data-figure="core"]').innerText()).split(' · ')[0];
    await page.locator('gw-design-panel').getByRole('combobox', { name: 'Core' }).click();
    const other = page.getByRole('option').filter({ hasNotText: coreBefore }).first();
    const otherCore = (await other.innerText()).replace(' (ours)', '').trim();
    await other.click();
    await page.locator('[data-figure="core"]', { hasText: otherCore }).waitFor();
    expect(await page.getByRole('spinbutton', { name: 'Turns' }).inputValue()).toBe(
      await page.locator('[data-figure="turns"]').innerText(),
    );

    // The design page in the dark theme: no serious or critical axe findings either.
    await page.getByRole('button', { name: 'Switch to dark theme' }).click();
    await page.getByRole('button', { name: 'Switch to light theme' }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.locator('gw-design-panel').screenshot({ path: screenshotPath('designs-design-panel-dark') });
    await page.getByRole('button', { name: 'Switch to light theme' }).click();
    await context.close();
  }, 240_000);
});
