import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;

describe('user cores from a CSV file and from effective parameters', () => {
  it('imports the core template, adds a gapped core after the server names an inconsistent Ve, versions a core by re-import, and a reviewer retires one', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/cores');
    await page.getByRole('cell', { name: 'Shipped' }).first().waitFor();

    await page.getByRole('button', { name: 'Import cores from a CSV file' }).click();
    const template = await page.request.get('/api/catalogue/cores/template.csv');
    expect(template.status()).toBe(200);
    await page
      .getByLabel('Core CSV file', { exact: true })
      .setInputFiles({ name: 'cores.csv', mimeType: 'text/csv', buffer: await template.body() });
    await page.getByText(/2 rows: 2 new/).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.getByRole('button', { name: 'Import these cores' }).click();
    await page.getByLabel('Filter by name or source').fill('Example');
    await page.getByRole('cell', { name: 'Example ring 20/10/7 (illustrative)', exact: true }).waitFor();
    await page.getByRole('cell', { name: 'Example E-core EX-1 (illustrative)', exact: true }).waitFor();
    // IEC 60205 for a 20/10/7 mm ring (sharp-edged ring formula Ae = C1/C2, from memory; computed): Ae = 33.63 mm²
    await page.getByRole('cell', { name: '33.6', exact: true }).waitFor();

    await page.getByRole('button', { name: 'Add a gapped core from its effective parameters' }).click();
    const form = page.locator('gw-shaped-core-form');
    // Invented parameters; Ve is typed 12.5 % above Ae·le = 8000 mm³ on purpose.
    const typed: [string, string][] = [
      ['Name', 'Lab set 36 (browser test)'],
      ['Ae, effective area (mm²)', '100'],
      ['le, effective path length (mm)', '80'],
      ['Ve, effective volume (mm³)', '9000'],
      ['Window area (mm²)', '150'],
      ['Window height (mm)', '20'],
      ['Bobbin winding width (mm)', '18'],
      ['Bobbin winding height (mm)', '6'],
      ['Mean length of a turn (mm)', '60'],
      ['Outer surface for cooling (cm²)', '30'],
      ['Source of the numbers', 'invented for a browser test'],
    ];
    for (const [label, value] of typed) await form.getByLabel(label, { exact: true }).fill(value);
    await form.getByText('Ae·le = 8000 mm³').waitFor();
    await form.getByRole('button', { name: 'Add the gapped core' }).click();
    await form.getByText(/Ve differs from Ae·le by 12\.5 %/).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('cores-gapped-error'), fullPage: true });

    await form.getByLabel('Ve, effective volume (mm³)', { exact: true }).fill('8000');
    await form.getByRole('button', { name: 'Add the gapped core' }).click();
    await page.getByLabel('Filter by name or source').fill('Lab set 36');
    await page.getByRole('cell', { name: 'Lab set 36 (browser test)', exact: true }).waitFor();
    await page.screenshot({ path: screenshotPath('cores-gapped-added'), fullPage: true });

    // Edit it: the form starts from the stored parameters and saves version 2.
    await page.getByRole('button', { name: 'Edit Lab set 36 (browser test)' }).click();
    await page.getByText('Edit Lab set 36 (browser test): a new version of the gapped core').waitFor();
    expect(await form.getByLabel('Ve, effective volume (mm³)', { exact: true }).inputValue()).toBe('8000');
    await form.getByLabel('Mean length of a turn (mm)', { exact: true }).fill('62');
    await form.getByRole('button', { name: 'Save as version 2' }).click();
    await page.getByRole('cell', { name: /\(v2\)/ }).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);

    // The same template again: the E set becomes version 2, the ring is skipped.
    await page.getByRole('button', { name: 'Import cores from a CSV file' }).click();
    await page
      .getByLabel('Core CSV file', { exact: true })
      .setInputFiles({ name: 'cores-again.csv', mimeType: 'text/csv', buffer: await template.body() });
    await page.getByText(/2 rows: 0 new, 2 /).waitFor();
    await page.getByRole('combobox', { name: 'What to do with Example E-core EX-1 (illustrative)' }).click();
    await page.getByRole('option', { name: 'New version' }).click();
    await page.getByRole('combobox', { name: 'What to do with Example ring 20/10/7 (illustrative)' }).click();
    await page.getByRole('option', { name: 'Skip' }).click();
    await page.getByRole('button', { name: 'Import these cores' }).click();
    await page.getByText('cores-again.csv: 0 cores added, 1 new versions, 1 skipped.').waitFor();
    await page.getByLabel('Filter by name or source').fill('Example');
    await page.getByRole('button', { name: 'Versions of Example E-core EX-1 (illustrative)' }).click();
    await page.getByRole('heading', { name: 'Versions of Example E-core EX-1 (illustrative)' }).waitFor();
    const versions = page.locator('.gw-history tr.mat-mdc-row');
    await versions.nth(1).waitFor();
    expect(await versions.allInnerTexts()).toEqual([expect.stringMatching(/^v2\b/), expect.stringMatching(/^v1\b/)]);
    expect(await seriousAxeFindings(page)).toEqual([]);
    // Only reviewers and administrators retire; an engineer sees no such button.
    expect(await page.getByRole('button', { name: /^Retire / }).count()).toBe(0);
    await context.close();

    const reviewer = DEMO_USERS.find((u) => u.role === 'reviewer')!;
    const second = await h.newPage();
    await signIn(second.page, reviewer.username, reviewer.password);
    await second.page.goto('/cores');
    await second.page.getByLabel('Filter by name or source').fill('Example ring');
    await second.page.getByRole('button', { name: 'Retire Example ring 20/10/7 (illustrative)' }).click();
    await second.page.getByRole('button', { name: 'Restore Example ring 20/10/7 (illustrative)' }).waitFor();
    await second.page.getByText(/\(v1\), retired/).waitFor();
    await second.context.close();
  }, 240_000);
});
