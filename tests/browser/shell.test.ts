import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h?.close());

const userWith = (role: Role) => DEMO_USERS.find((u) => u.role === role)!;

const EXPECTED_NAVIGATION: Record<Role, { sees: string[]; doesNotSee: string[] }> = {
  engineer: {
    sees: ['Home', 'Designs', 'Materials', 'Cores', 'Compare', 'Winding shop'],
    doesNotSee: ['Users', 'Audit log', 'Review', 'Outbox'],
  },
  reviewer: { sees: ['Home', 'Designs', 'Review', 'Winding shop'], doesNotSee: ['Users', 'Audit log', 'Outbox'] },
  winder: { sees: ['Home', 'Winding shop'], doesNotSee: ['Designs', 'Materials', 'Users', 'Audit log'] },
  admin: { sees: ['Home', 'Users', 'Audit log', 'Outbox', 'Settings'], doesNotSee: ['Review'] },
};

describe.each(Object.keys(EXPECTED_NAVIGATION) as Role[])('signed in as %s', (role) => {
  it('sees the navigation of the role, the caution, and can sign out', async () => {
    const { context, page } = await h.newPage();
    const user = userWith(role);
    await signIn(page, user.username, user.password);
    const nav = page.getByRole('navigation', { name: 'Main navigation' });
    for (const label of EXPECTED_NAVIGATION[role].sees) await nav.getByRole('link', { name: label }).waitFor();
    for (const label of EXPECTED_NAVIGATION[role].doesNotSee) expect(await nav.getByRole('link', { name: label }).count()).toBe(0);
    await page
      .getByText(/engineering estimates/i)
      .first()
      .waitFor();
    await page.screenshot({ path: screenshotPath(`shell-${role}`), fullPage: true });
    await page.getByRole('button', { name: 'Account menu' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await context.close();
  });
});

describe('the shell', () => {
  it('shows an error under the form for a wrong password', async () => {
    const { context, page } = await h.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('Username').fill('erin');
    await page.getByLabel('Password', { exact: true }).fill('definitely-wrong');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(/wrong username or password/i).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });

  it('toggles dark mode and remembers it after a reload', async () => {
    const { context, page } = await h.newPage();
    const user = userWith('engineer');
    await signIn(page, user.username, user.password);
    const schemeOf = () => page.evaluate(() => getComputedStyle(document.documentElement).colorScheme);
    await page.getByRole('button', { name: 'Switch to dark theme' }).click();
    await expect.poll(schemeOf).toBe('dark');
    const darkBackground = await page.evaluate(() => getComputedStyle(document.body).backgroundColor);
    await page.reload();
    await page.getByRole('button', { name: 'Switch to light theme' }).waitFor();
    expect(await schemeOf()).toBe('dark');
    expect(await page.evaluate(() => getComputedStyle(document.body).backgroundColor)).toBe(darkBackground);
    await page.screenshot({ path: screenshotPath('shell-dark'), fullPage: true });
    await page.getByRole('button', { name: 'Switch to light theme' }).click();
    await expect.poll(schemeOf).toBe('light');
    await context.close();
  });

  it('sends an unknown page to the 404 page', async () => {
    const { context, page } = await h.newPage();
    const user = userWith('engineer');
    await signIn(page, user.username, user.password);
    await page.goto('/no/such/page');
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();
    await context.close();
  });

  it('keeps an engineer out of the admin screens even by typing the address', async () => {
    const { context, page } = await h.newPage();
    const user = userWith('engineer');
    await signIn(page, user.username, user.password);
    await page.goto('/admin/users');
    await page.waitForURL((url) => url.pathname === '/');
    expect(await page.getByRole('heading', { name: 'Users' }).count()).toBe(0);
    await context.close();
  });
});

describe('accessibility (axe): no serious or critical findings', () => {
  const screens: { name: string; role: Role | null; path: string; ready: string }[] = [
    { name: 'sign-in', role: null, path: '/sign-in', ready: 'Sign in to Gapwright' },
    { name: 'home', role: 'engineer', path: '/', ready: 'Welcome, Erin Calder' },
    { name: 'account', role: 'engineer', path: '/account', ready: 'My account' },
    { name: 'users', role: 'admin', path: '/admin/users', ready: 'Users' },
    { name: 'audit', role: 'admin', path: '/admin/audit', ready: 'Audit log' },
    { name: 'not-found', role: 'engineer', path: '/nowhere', ready: 'Page not found' },
  ];
  for (const theme of ['light', 'dark'] as const) {
    it.each(screens)(`$name in the ${theme} theme`, async ({ role, path, ready }) => {
      const { context, page } = await h.newPage();
      await page.addInitScript((t) => localStorage.setItem('gapwright.theme', t), theme);
      if (role) {
        const user = userWith(role);
        await signIn(page, user.username, user.password);
        await page.evaluate(
          (t) =>
            fetch('/api/account/preferences', {
              method: 'PATCH',
              headers: {
                'Content-Type': 'application/json',
                'X-XSRF-TOKEN': decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(document.cookie)?.[1] ?? ''),
              },
              body: JSON.stringify({ theme: t }),
            }),
          theme,
        );
      }
      await page.goto(path);
      await page.getByRole('heading', { name: ready, exact: true }).first().waitFor();
      expect(await seriousAxeFindings(page)).toEqual([]);
      await context.close();
    });
  }
});
