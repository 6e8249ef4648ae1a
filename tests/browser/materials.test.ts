import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { fromDisplay, parseQuantity } from '@shared/units/index';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
const TEMPLATE_NAMES = ['Example ferrite EF-1 (illustrative)', 'Example powder EP-2 (illustrative)'];

describe('material library, comparison and cores', () => {
  it('uploads the template, previews it, commits, and shows both materials in the table and the chart', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/materials');
    await page.getByRole('heading', { name: 'Materials', level: 1 }).waitFor();
    await page.getByRole('cell', { name: 'Demo ferrite Amber (illustrative)', exact: true }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);

    const template = await page.request.get('/api/materials/template.csv');
    expect(template.status()).toBe(200);
    await page
      .getByLabel('Material CSV file', { exact: true })
      .setInputFiles({ name: 'template.csv', mimeType: 'text/csv', buffer: await template.body() });
    await page.getByRole('heading', { name: 'Preview of template.csv' }).waitFor();
    await page.getByText('2 rows: 2 new, 0 already in the library, 0 with problems.').waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('materials-preview'), fullPage: true });

    await page.getByRole('button', { name: 'Import these materials' }).click();
    for (const name of TEMPLATE_NAMES) await page.getByRole('cell', { name, exact: true }).waitFor();
    await page.getByRole('cell', { name: /2 rows: 2 new/ }).waitFor();
    await page.getByRole('button', { name: 'Versions of Example ferrite EF-1 (illustrative)' }).click();
    await page.getByRole('heading', { name: 'Versions of Example ferrite EF-1 (illustrative)' }).waitFor();
    await page.getByRole('cell', { name: 'v1 (current)' }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('materials-library'), fullPage: true });

    await page.goto('/compare');
    await page.getByRole('heading', { name: 'Compare materials' }).waitFor();
    await page.getByRole('combobox', { name: 'Materials' }).click();
    // Replace the default choice with the two uploaded materials.
    const chosen = page.getByRole('option', { selected: true });
    for (let left = await chosen.count(); left > 0; left--) await chosen.first().click();
    for (const name of TEMPLATE_NAMES) await page.getByRole('option', { name: new RegExp(name.replace(/[()]/g, '\\$&')) }).click();
    await page.keyboard.press('Escape');
    await page.getByRole('button', { name: 'Draw curves' }).click();
    await page.getByText(/Core-loss density against frequency at ΔB = 200 mT/).waitFor();
    await page.locator('.gw-chart canvas').first().waitFor();
    await page.waitForTimeout(500);
    await page.screenshot({ path: screenshotPath('compare-curves'), fullPage: true });
    // ngx-echarts marks the element once echarts has drawn into it.
    expect(await page.locator('.gw-chart').first().getAttribute('_echarts_instance_')).toBeTruthy();

    await page.getByRole('radio', { name: 'A design typed in here' }).click();
    await page.getByRole('button', { name: 'Compare on this design' }).click();
    await page.getByRole('cell', { name: 'Example ferrite EF-1 (illustrative)', exact: true }).waitFor();
    await page.getByRole('cell', { name: 'Does not fit this core' }).first().waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('compare-design'), fullPage: true });
    await context.close();
    // A long walk through three screens with four axe scans; a busy machine needs more than the default minute.
  }, 180_000);

  it('compares a saved revision from its design page, with the material it was built with marked', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/designs');
    await page
      .getByRole('row', { name: /Telecom rail 48 V/ })
      .getByRole('link')
      .first()
      .click();
    await page.getByRole('link', { name: 'Compare materials on revision 1' }).click();
    await page.waitForURL(/\/compare\?design=\d+&revision=1/);
    await page.getByRole('heading', { name: /revision 1 · Telecom rail 48 V/ }).waitFor();
    await page.getByText("this design's material").waitFor();
    expect(await page.getByText("this design's material").count()).toBe(1);
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('compare-saved-design'), fullPage: true });

    // The curves drawn where this design's core works.
    const point = await page.locator('.gw-flux-point').innerText();
    const deltaB = /ΔB = ([\d.,]+) mT/.exec(point)![1];
    await page.getByRole('button', { name: 'Draw the loss curves there' }).click();
    await page.getByText(`Core-loss density against frequency at ΔB = ${deltaB} mT`).waitFor();
    // The field holds the same swing, typed back with its unit ("123.4 mT").
    const typed = parseQuantity(await page.getByLabel('ΔB for the frequency sweep, peak to peak').inputValue(), 'fluxDensity');
    if (!typed.ok) throw new Error(typed.error);
    expect(Math.abs(typed.value - fromDisplay(Number(deltaB.replace(/,/g, '')), 'mT'))).toBeLessThanOrEqual(fromDisplay(0.05, 'mT'));
    await context.close();
  }, 120_000);

  it('shows a hostile file’s problems by row and column and writes nothing', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/materials');
    await page.getByRole('cell', { name: 'Demo ferrite Amber (illustrative)', exact: true }).waitFor();
    const header = 'name,family,unit_set,k,alpha,beta,f_min,f_max,b_min,b_max,bsat_25,bsat_100,mu_i,density,provenance';
    const csv = `${header}\nBad one,ferrite,W/m3-Hz-T,-1,0.5,2.6,50000,300000,0.02,0.25,0.5,0.4,2000,4800,test\n`;
    await page
      .getByLabel('Material CSV file', { exact: true })
      .setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByText('1 rows: 0 new, 0 already in the library, 1 with problems.', { exact: false }).waitFor();
    await page.getByText('k must be greater than 0 (got -1)').waitFor();
    await page.getByText('alpha must be between 1 and 3 (got 0.5)').waitFor();
    expect(await page.getByRole('button', { name: 'Import these materials' }).isDisabled()).toBe(true);
    await page.screenshot({ path: screenshotPath('materials-problems'), fullPage: true });
    await context.close();
  });

  it('lists shipped cores, filters them and adds a ring core', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/cores');
    await page.getByRole('cell', { name: 'Shipped' }).first().waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.getByLabel('Filter by name or source').fill('ETD3');
    await page.getByRole('cell', { name: 'ETD34/17/11', exact: true }).waitFor();
    expect(await page.getByRole('cell', { name: 'ETD29/16/10', exact: true }).count()).toBe(0);
    await page.getByLabel('Filter by name or source').fill('');

    await page.getByRole('button', { name: 'Add a ring core from its dimensions' }).click();
    const ringForm = page.locator('gw-core-form');
    await ringForm.getByRole('button', { name: 'Add the ring core' }).click();
    await ringForm.getByText('Enter a name', { exact: true }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await ringForm.getByLabel('Name', { exact: true }).fill('Lab ring 25/15/10');
    await ringForm.getByLabel('Outer diameter (mm)').fill('25');
    await ringForm.getByLabel('Inner diameter (mm)').fill('15');
    await ringForm.getByLabel('Height (mm)').fill('10');
    await ringForm.getByRole('button', { name: 'Add the ring core' }).click();
    await page.getByLabel('Filter by name or source').fill('Lab ring');
    await page.getByRole('cell', { name: 'Lab ring 25/15/10', exact: true }).waitFor();
    // IEC 60205 sharp-edged value for 25/15/10 (ring formula Ae = C1/C2, from memory; computed): Ae = 48.93 mm²
    await page.getByRole('cell', { name: '48.9', exact: true }).waitFor();
    await page.screenshot({ path: screenshotPath('cores'), fullPage: true });
    await context.close();
  }, 120_000);
});

describe('the new screens in the dark theme (axe)', () => {
  it('has no serious or critical findings on Materials, Compare and Cores', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.getByRole('button', { name: 'Switch to dark theme' }).click();
    await page.getByRole('button', { name: 'Switch to light theme' }).waitFor();

    await page.goto('/materials');
    await page.getByRole('cell', { name: 'Demo ferrite Amber (illustrative)', exact: true }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);

    await page.goto('/compare');
    await page.locator('.gw-chart canvas').first().waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('compare-dark'), fullPage: true });

    await page.goto('/cores');
    await page.getByRole('cell', { name: 'Shipped' }).first().waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.getByRole('button', { name: 'Switch to light theme' }).click();
    await context.close();
  }, 120_000);
});
