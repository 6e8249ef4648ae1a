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
  it('imports the core template, then adds a gapped core after the server points at an inconsistent volume', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/cores');
    await page.getByRole('cell', { name: 'Shipped' }).first().waitFor();

    await page.getByRole('button', { name: 'Import cores from a CSV file' }).click();
    const template = await page.request.get('/api/catalogue/cores/template.csv');
    expect(template.status()).toBe(200);
    await page.getByLabel('Core CSV file', { exact: true }).setInputFiles({ name: 'cores.csv', mimeType: 'text/csv', buffer: await template.body() });
    await page.getByText(/2 rows: 2 new/).waitFor();
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.getByRole('button', { name: 'Import these cores' }).click();
    await page.getByLabel('Filter by name or source').fill('Example');
    await page.getByRole('cell', { name: 'Example ring 20/10/7 (illustrative)', exact: true }).waitFor();
    await page.getByRole('cell', { name: 'Example E-core EX-1 (illustrative)', exact: true }).waitFor();
    // IEC 60205 for a 20/10/7 mm ring (magnetics reference §12.3): Ae = 33.63 mm²
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
    await context.close();
  }, 180_000);
});
