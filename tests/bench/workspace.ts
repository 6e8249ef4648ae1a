import { performance } from 'node:perf_hooks';
import { ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { signIn, startHarness } from '../browser/support/harness.ts';
import type { BenchRow } from './engine.ts';
import { median } from './stats.ts';

const DATABASE = 'gapwright_bench_workspace';
const RUNS = 5;
/** The design panel waits this long after the last keystroke before it asks the server (design-panel.ts). */
const EDIT_DEBOUNCE_MS = 300;

/**
 * In Chromium against the real server (needs `npm run build` first): time from pressing "Search candidates" to the
 * table drawn for the demo telecom spec, and from a turns change to the re-evaluated figures on screen.
 */
export async function runWorkspaceBench(): Promise<BenchRow[]> {
  const cluster = ensureCluster();
  ensureDatabase(DATABASE);
  process.env['TEST_DATABASE_URL'] ??= cluster.urlFor(DATABASE);
  const harness = await startHarness();
  try {
    const { page } = await harness.newPage();
    const erin = DEMO_USERS.find((u) => u.username === 'erin')!;
    await signIn(page, erin.username, erin.password);
    await page.goto('/designs/new');
    const spec: [string, string][] = [
      ['Vin min', '36 V'],
      ['Vin max', '60 V'],
      ['Vout', '12 V'],
      ['Iout max', '8 A'],
      ['Switching frequency', '200 kHz'],
      ['Current limit', '11 A'],
    ];
    for (const [label, text] of spec) {
      const field = page.getByRole('textbox', { name: label, exact: true });
      await field.fill(text);
      await field.blur();
    }
    await page.locator('[data-figure="inductance"]').waitFor();

    const searchTimes: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      const started = performance.now();
      await page.getByRole('button', { name: 'Search candidates' }).click();
      await page.locator(`[data-testid="search-status"][data-searches-done="${run + 1}"]`).waitFor({ timeout: 60_000 });
      await page.locator('[data-testid="candidates-table"] tr.mat-mdc-row').first().waitFor();
      searchTimes.push(performance.now() - started);
    }

    await page.locator('[data-testid="candidates-table"] tr.mat-mdc-row').first().click();
    await page.getByRole('button', { name: 'Use selected candidate' }).click();
    const turnsField = page.getByRole('spinbutton', { name: 'Turns' });
    await page.locator('[data-figure="total-loss"]').waitFor();
    const base = Number(await turnsField.inputValue());
    const evaluateTimes: number[] = [];
    const requestTimes: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      const turns = base + 1 + run;
      // Timed inside the page (input event → the figure's text changed, seen by a MutationObserver), so the
      // test driver's polling does not count; the evaluate request is timed on its own beside it.
      const shown = page.evaluate(
        (expected) =>
          new Promise<number>((resolve) => {
            // This file is also type-checked without the DOM library (the benchmark runner imports it): the few
            // browser objects used here are described by hand.
            interface Node {
              textContent: string | null;
              addEventListener(type: string, listener: () => void, options: object): void;
            }
            const page = globalThis as unknown as {
              document: { querySelector(selector: string): Node };
              MutationObserver: new (callback: (changes: unknown, observer: { disconnect(): void }) => void) => {
                observe(target: Node, options: object): void;
              };
            };
            const figure = page.document.querySelector('[data-figure="turns"]');
            const input = page.document.querySelector('input[formcontrolname="turns"]');
            let started = 0;
            input.addEventListener('input', () => (started = performance.now()), { once: true });
            new page.MutationObserver((_changes, observer) => {
              if (figure.textContent?.trim() === expected) {
                observer.disconnect();
                resolve(performance.now() - started);
              }
            }).observe(figure, { childList: true, characterData: true, subtree: true });
          }),
        String(turns),
      );
      const request = page.waitForResponse((r) => r.url().includes('/api/calc/evaluate'));
      await turnsField.fill(String(turns));
      const response = await request;
      evaluateTimes.push(await shown);
      // The timing's responseEnd is -1 until the body has arrived. Bounded: once, in a full bench run, this wait never
      // ended; a bench that stops with a reason beats one that hangs.
      await Promise.race([
        response.finished(),
        new Promise((_, reject) => setTimeout(() => reject(new Error('the evaluate response did not finish within 30 s')), 30_000).unref()),
      ]);
      const timing = response.request().timing();
      requestTimes.push(timing.responseEnd - timing.requestStart);
    }
    const searchMs = median(searchTimes);
    const evaluateMs = median(evaluateTimes);
    const requestMs = median(requestTimes);
    return [
      { name: 'workspace: "search" to candidates table (demo telecom spec, median of 5)', value: `${searchMs.toFixed(0)} ms` },
      {
        name: 'workspace: turns change to figures on screen, timed in the page (median of 5)',
        value: `${evaluateMs.toFixed(0)} ms (${(evaluateMs - EDIT_DEBOUNCE_MS).toFixed(0)} ms after the ${EDIT_DEBOUNCE_MS} ms debounce)`,
      },
      { name: 'workspace: of which the evaluate request (with its loss sweep)', value: `${requestMs.toFixed(0)} ms` },
    ];
  } finally {
    await harness.close();
  }
}
