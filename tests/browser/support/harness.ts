import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../../server/server.ts';
import { resetTestDatabase, testConfig } from '../../api/support/test-app.ts';

export const RESULTS_DIR = process.env['TEST_RESULTS_DIR'] ?? path.resolve('test-results');

// Flags that keep Debian's Chromium quiet on a machine with no outside network.
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface Harness {
  baseUrl: string;
  browser: Browser;
  newPage: () => Promise<{ context: BrowserContext; page: Page }>;
  close: () => Promise<void>;
}

/** The real server (built web app + API) on a free port over the suite's throwaway database, and Chromium. */
export async function startHarness(): Promise<Harness> {
  const config = { ...testConfig({ STATIC_DIR: path.resolve('dist/gapwright/browser'), FAKE_SMTP_PORT: '0' }), port: 0 };
  await resetTestDatabase(config);
  const server: RunningServer = await startServer(config);
  // playwright-core starts Chromium with a fresh, throwaway profile directory of its own.
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  mkdirSync(RESULTS_DIR, { recursive: true });
  return {
    baseUrl: server.url,
    browser,
    newPage: async () => {
      const context = await browser.newContext({ baseURL: server.url, viewport: { width: 1280, height: 800 } });
      return { context, page: await context.newPage() };
    },
    close: async () => {
      await browser.close();
      await server.stop();
    },
  };
}

export async function signIn(page: Page, username: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

export interface AxeFinding {
  id: string;
  impact: string | null | undefined;
  help: string;
  targets: string[];
}

/** Serious and critical accessibility findings on the page as it is now. */
export async function seriousAxeFindings(page: Page): Promise<AxeFinding[]> {
  // A field error fading in is half transparent for a moment, and axe reads its contrast from the blend: let every
  // finite animation end first (endless ones, such as a progress bar, are left; at most two seconds).
  // Passed as text: this file is also type-checked without the DOM library.
  await page.evaluate(`(async () => {
    const finite = document.getAnimations().filter((a) => Number.isFinite(Number(a.effect?.getComputedTiming().endTime)));
    const settled = Promise.all(finite.map((a) => a.finished.catch(() => undefined)));
    await Promise.race([settled, new Promise((resolve) => setTimeout(resolve, 2000))]);
  })()`);
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
}

export const screenshotPath = (name: string) => path.join(RESULTS_DIR, `${name}.png`);
