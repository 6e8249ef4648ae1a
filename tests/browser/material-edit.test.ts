import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
const MATERIAL = 'Demo ferrite Amber (illustrative)';
const ALPHA = 'α, frequency exponent (no unit)';
const BETA = 'β, flux exponent (no unit)';

describe('editing a material in the library', () => {
  it('saves a changed β as a new version, and refuses an α out of range with nothing saved', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, engineer.username, engineer.password);
    await page.goto('/materials');
    const row = page.getByRole('row').filter({ has: page.getByRole('cell', { name: MATERIAL, exact: true }) });
    await row.waitFor();
    await row.getByRole('cell', { name: 'v1', exact: true }).waitFor();

    await page.getByRole('button', { name: `Versions of ${MATERIAL}` }).click();
    const versions = page.getByRole('region', { name: 'Versions of the material, scrollable' });
    await versions.getByRole('cell', { name: 'v1 (current)' }).waitFor();

    await page.getByRole('button', { name: `Edit ${MATERIAL}` }).click();
    const dialog = page.getByRole('dialog', { name: `Edit ${MATERIAL}` });
    await dialog.waitFor();
    // Focus moves into the form; the demo seed gives this material β = 2.65.
    expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    expect(await dialog.getByLabel(BETA).inputValue()).toBe('2.65');
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('material-edit'), fullPage: true });

    await dialog.getByLabel(BETA).fill('2.7');
    await dialog.getByRole('button', { name: 'Save as version 2' }).click();
    await page.getByText(`Saved as version 2 of ${MATERIAL}`).waitFor();
    await dialog.waitFor({ state: 'detached' });
    await row.getByRole('cell', { name: 'v2', exact: true }).waitFor();
    expect(await row.getByRole('cell', { name: /· 1\.4 · 2\.7$/ }).count()).toBe(1);
    // The open Versions panel follows the edit.
    await versions.getByRole('cell', { name: 'v2 (current)' }).waitFor();
    expect(await versions.getByRole('cell', { name: 'v1', exact: true }).count()).toBe(1);

    // α = 3.5 is outside 1 ≤ α ≤ 3, the import's rule (README, material CSV format).
    await page.getByRole('button', { name: `Edit ${MATERIAL}` }).click();
    await dialog.waitFor();
    await dialog.getByLabel(ALPHA).fill('3.5');
    await dialog.getByRole('button', { name: 'Save as version 3' }).click();
    await dialog.getByRole('alert').filter({ hasText: 'alpha must be between 1 and 3 (got 3.5)' }).waitFor();
    const alphaField = dialog.locator('mat-form-field').filter({ has: page.getByLabel(ALPHA) });
    expect((await alphaField.locator('mat-error').textContent())?.trim()).toBe('alpha must be between 1 and 3 (got 3.5)');
    expect(await dialog.getByLabel(ALPHA).getAttribute('aria-invalid')).toBe('true');
    expect(await dialog.getByLabel(ALPHA).evaluate((input) => input === document.activeElement)).toBe(true);
    expect(await seriousAxeFindings(page)).toEqual([]);
    await page.screenshot({ path: screenshotPath('material-edit-error'), fullPage: true });

    // Escape closes the form; nothing was saved: still version 2.
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: `Versions of ${MATERIAL}` }).click();
    await versions.getByRole('cell', { name: 'v2 (current)' }).waitFor();
    expect(await versions.getByRole('cell', { name: /^v3/ }).count()).toBe(0);
    expect(await row.getByRole('cell', { name: 'v2', exact: true }).count()).toBe(1);

    // A demo design built with version 1 still names it on its design page (it is no longer current).
    await page.goto('/designs');
    await page
      .getByRole('row', { name: /Industrial board 24 V/ })
      .getByRole('link')
      .first()
      .click();
    const materialField = page.locator('gw-design-panel').getByRole('combobox', { name: 'Material' });
    await materialField.filter({ hasText: `${MATERIAL} (the version this design uses; since replaced)` }).waitFor();
    await context.close();
  }, 120_000);
});
