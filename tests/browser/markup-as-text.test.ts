import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, signIn, startHarness, type Harness } from './support/harness.ts';
import { apiWrite, apiWriteJson } from './support/page-api.ts';

// Names are shown as text: markup typed into a display name or a design title never becomes HTML.
const HOSTILE_NAME = '<img src=x onerror="window.__injected=1"><b>Mallory</b>';
const HOSTILE_TITLE = '<script>window.__injected=2</script><i>Choke</i>';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const user = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

describe('markup in names', () => {
  it('shows a display name with markup as text in the users table', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, user('admin').username, user('admin').password);
    const status = await page.evaluate(
      apiWrite('POST', '/api/admin/users', {
        username: 'mallory',
        displayName: HOSTILE_NAME,
        role: 'engineer',
        password: 'a long passphrase',
      }),
    );
    expect(status).toBe(201);
    await page.goto('/admin/users');
    await page.getByText(HOSTILE_NAME, { exact: true }).first().waitFor();
    expect(await page.locator('table img, table b').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __injected?: number }).__injected)).toBeUndefined();
    await page.screenshot({ path: screenshotPath('markup-as-text-users') });
    await context.close();
  });

  it('shows a design title with markup as text in the designs list and on the design page', async () => {
    const { context, page } = await h.newPage();
    await signIn(page, user('engineer').username, user('engineer').password);
    const copied = await page.evaluate(apiWriteJson('POST', '/api/designs/1/copy', { title: HOSTILE_TITLE }));
    const id = (copied as { id: number }).id;
    expect(id).toBeGreaterThan(0);
    await page.goto('/designs');
    await page.getByText(HOSTILE_TITLE).first().waitFor();
    expect(await page.locator('table script, table i').count()).toBe(0);
    await page.goto(`/designs/${id}`);
    await page.getByRole('heading', { level: 1 }).filter({ hasText: HOSTILE_TITLE }).waitFor();
    expect(await page.locator('main i, main script:not([src])').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __injected?: number }).__injected)).toBeUndefined();
    await context.close();
  });
});
