import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CORE_CSV_COLUMNS } from '@shared/schemas/core-csv';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, signIn, startHarness, type Harness } from './support/harness.ts';
import { apiWriteJson, csvCommit } from './support/page-api.ts';

// echarts draws tooltips as HTML. A material and a user core named with markup are hovered on every chart
// they can reach: the tooltip shows the name as text, no element of the name is created, the page stays.
const MATERIAL_NAME = '<meta http-equiv="refresh" content="0;url=/x"><b>bold</b>';
const CORE_NAME = '<img src=x onerror="window.__injected=1">';
// 24–36 V to 12 V at 10 A: the 60/30/25 mm user ring is on the Pareto front of the powder rings.
const CONVERTER = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.4 };

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 120_000);
afterAll(() => h?.close());

const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
const csvCell = (text: string) => `"${text.replaceAll('"', '""')}"`;

/** The template's row starting with `templateName`, renamed (and changed by `edit`). */
async function templateRow(
  page: Page,
  url: string,
  templateName: string,
  name: string,
  edit: (row: string) => string = (r) => r,
): Promise<string> {
  const lines = (await (await page.request.get(url)).text()).trim().split('\n');
  return edit(lines.find((l) => l.startsWith(templateName))!.replace(templateName, csvCell(name)));
}

/** Hover a chart at a point and answer the text of its tooltip once shown. */
async function tooltipAt(page: Page, chart: Locator, position: { x: number; y: number }, expected: string): Promise<string> {
  await chart.hover({ position });
  const handle = await chart.elementHandle();
  await page.waitForFunction(({ el, text }) => !!el?.textContent?.includes(text), { el: handle, text: expected });
  return (await chart.textContent()) ?? '';
}

async function expectNothingInjected(page: Page, url: string): Promise<void> {
  // A live <meta http-equiv="refresh" content="0"> navigates at once; give it a moment to do so.
  await page.waitForTimeout(500);
  expect(page.url()).toBe(url);
  expect(await page.locator('.gw-chart img, .gw-chart meta, .gw-chart b, meta[http-equiv]').count()).toBe(0);
  expect(await page.evaluate(() => (window as unknown as { __injected?: number }).__injected)).toBeUndefined();
}

describe('markup in names on charts', () => {
  it('shows material and core names as text in the tooltips of the design page and the Compare page', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);

    const powder = await templateRow(page, '/api/materials/template.csv', 'Example powder EP-2 (illustrative)', MATERIAL_NAME);
    const material = (await page.evaluate(
      csvCommit('/api/materials/import/commit', `${MATERIAL_CSV_COLUMNS.join(',')}\n${powder}\n`, 'markup.csv'),
    )) as { materialIds: number[] };
    const materialId = String(material.materialIds[0]);
    const ring = await templateRow(page, '/api/catalogue/cores/template.csv', 'Example ring 20/10/7 (illustrative)', CORE_NAME, (r) =>
      // A powder toroid, so it pairs with the powder material (ferrite-ring sizes never do).
      r.replace(',RING,', ',POWDER_TOROID,').replace(',20,10,7,', ',60,30,25,'),
    );
    const core = (await page.evaluate(
      csvCommit('/api/catalogue/cores/import/commit', `${CORE_CSV_COLUMNS.join(',')}\n${ring}\n`, 'markup-cores.csv'),
    )) as { created: number };
    expect(core.created).toBe(1);
    const design = (await page.evaluate(
      apiWriteJson('POST', '/api/designs', {
        title: 'Markup names on charts',
        spec: { converter: CONVERTER, families: ['POWDER_TOROID'], materialIds: [materialId] },
        construction: { coreId: CORE_NAME, materialId, turns: 'auto', gap: 'auto', wire: { kind: 'awg', awg: 14, strands: 2 } },
      }),
    )) as { id: number };
    expect(design.id).toBeGreaterThan(0);

    // The design page: the candidates chart names core and material; the loss, flux and frequency charts do not, but are hovered too.
    const designUrl = `${h.baseUrl}/designs/${design.id}`;
    await page.goto(designUrl);
    await page.getByRole('button', { name: 'Search candidates' }).click();
    await page
      .getByTestId('search-status')
      .filter({ hasText: /feasible of/ })
      .waitFor({ timeout: 30_000 });
    const point = page.locator('.gw-point', { hasText: CORE_NAME }).first();
    await point.waitFor();
    const candidates = page.locator('gw-candidates-panel [echarts]');
    const position = { x: Number(await point.getAttribute('data-x')), y: Number(await point.getAttribute('data-y')) };
    const tooltip = await tooltipAt(page, candidates, position, CORE_NAME);
    expect(tooltip).toContain(`${CORE_NAME} · ${MATERIAL_NAME} · `);
    await page.screenshot({ path: screenshotPath('chart-markup-candidates'), fullPage: true });
    await expectNothingInjected(page, designUrl);

    const others = page.locator('gw-design-panel .gw-chart, gw-operating-point-panel .gw-chart');
    const count = await others.count();
    expect(count).toBeGreaterThanOrEqual(3);
    for (let i = 0; i < count; i++) {
      const chart = others.nth(i);
      await chart.scrollIntoViewIfNeeded();
      const box = (await chart.boundingBox())!;
      await chart.hover({ position: { x: box.width / 2, y: box.height / 2 } });
      await expectNothingInjected(page, designUrl);
    }

    // The Compare page: the loss curves of the material, its name in the axis tooltip and the legend.
    const compareUrl = `${h.baseUrl}/compare`;
    await page.goto(compareUrl);
    await page.getByRole('combobox', { name: 'Materials' }).click();
    const chosen = page.getByRole('option', { selected: true });
    for (let left = await chosen.count(); left > 0; left--) await chosen.first().click();
    await page.getByRole('option', { name: MATERIAL_NAME }).click();
    await page.keyboard.press('Escape');
    await page.getByRole('button', { name: 'Draw curves' }).click();
    const curves = page.locator('.gw-chart[_echarts_instance_]');
    await curves.first().waitFor();
    expect(await curves.count()).toBe(2);
    for (let i = 0; i < 2; i++) {
      const chart = curves.nth(i);
      await chart.scrollIntoViewIfNeeded();
      const box = (await chart.boundingBox())!;
      expect(await tooltipAt(page, chart, { x: box.width / 2, y: box.height / 2 }, MATERIAL_NAME)).toContain(MATERIAL_NAME);
      await expectNothingInjected(page, compareUrl);
    }
    await page.screenshot({ path: screenshotPath('chart-markup-compare'), fullPage: true });

    // One design across materials (a table, not a chart): the name is a table cell's text.
    await page.goto(`${h.baseUrl}/compare?design=${design.id}&revision=1`);
    await page.getByRole('cell', { name: MATERIAL_NAME }).first().waitFor();
    await expectNothingInjected(page, `${h.baseUrl}/compare?design=${design.id}&revision=1`);
    await context.close();
  }, 180_000);
});
