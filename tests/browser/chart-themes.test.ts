import pg from 'pg';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { testConfig } from '../api/support/test-app.ts';
import { screenshotPath, seriousAxeFindings, signIn, startHarness, type Harness } from './support/harness.ts';

// The design page's charts drawn in the light theme, then re-drawn when the toolbar switches to dark: read back from
// the canvases' pixels, every colour drawn is the theme's and stands out from the page (WCAG 2.1 contrast ratio).

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 120_000);
afterAll(() => h?.close());

const erin = DEMO_USERS.find((u) => u.username === 'erin')!;

async function seededDesignId(): Promise<number> {
  const pool = new pg.Pool({ connectionString: testConfig({}).databaseUrl, max: 1 });
  try {
    const { rows } = await pool.query<{ design_id: number }>(
      `select r.design_id from design_revisions r join designs d on d.id = r.design_id join users u on u.id = d.owner_id
        where u.username = 'erin' and (r.result -> 'evaluation' ->> 'feasible') = 'true' order by d.id limit 1`,
    );
    return rows[0]!.design_id;
  } finally {
    await pool.end();
  }
}

/** WCAG 2.1 contrast ratio of two `#rrggbb` colours (relative luminance of sRGB). */
function contrast(a: string, b: string): number {
  const luminance = (hex: string) =>
    [0, 1, 2]
      .map((i) => parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255)
      .map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4))
      .reduce((sum, c, i) => sum + c * [0.2126, 0.7152, 0.0722][i]!, 0);
  const [light, dark] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (light! + 0.05) / (dark! + 0.05);
}

interface Sample {
  system: Record<'surface' | 'onSurface' | 'onSurfaceVariant' | 'outline' | 'outlineVariant' | 'primary' | 'tertiary', string>;
  charts: { label: string; background: string; pixels: Record<string, number> }[];
}

/** The system colours as the browser resolves them now, and each chart's fully opaque pixels counted by colour. */
function sample(page: Page): Promise<Sample> {
  return page.evaluate(() => {
    const hex = (rgb: string) =>
      '#' +
      (rgb.match(/\d+/g) ?? [])
        .slice(0, 3)
        .map((c) => Number(c).toString(16).padStart(2, '0'))
        .join('');
    const probe = document.body.appendChild(document.createElement('span'));
    const token = (name: string) => {
      probe.style.color = `var(--mat-sys-${name})`;
      return hex(getComputedStyle(probe).color);
    };
    const system = {
      surface: token('surface'),
      onSurface: token('on-surface'),
      onSurfaceVariant: token('on-surface-variant'),
      outline: token('outline'),
      outlineVariant: token('outline-variant'),
      primary: token('primary'),
      tertiary: token('tertiary'),
    };
    probe.remove();
    const backgroundOf = (start: Element | null): string => {
      for (let el = start; el; el = el.parentElement) {
        const colour = getComputedStyle(el).backgroundColor;
        if (!/^rgba\(.*, 0\)$|transparent/.test(colour)) return hex(colour);
      }
      return system.surface;
    };
    const charts = Array.from(document.querySelectorAll('gw-design-panel .gw-chart, gw-operating-point-panel .gw-chart')).map((chart) => {
      const canvas = chart.querySelector('canvas')!;
      const data = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
      const pixels: Record<string, number> = {};
      for (let i = 0; i < data.length; i += 4) {
        if (data[i + 3] !== 255) continue;
        const colour = '#' + [data[i]!, data[i + 1]!, data[i + 2]!].map((c) => c.toString(16).padStart(2, '0')).join('');
        pixels[colour] = (pixels[colour] ?? 0) + 1;
      }
      return { label: chart.getAttribute('aria-label') ?? '', background: backgroundOf(chart), pixels };
    });
    return { system, charts };
  });
}

/** Each chart's colours against its background: drawn marks at 3:1 or more, the text colours at 4.5:1 or more. */
function expectReadable({ system, charts }: Sample): void {
  expect(charts.length).toBeGreaterThanOrEqual(5);
  for (const { label, background, pixels } of charts) {
    expect(background, label).toBe(system.surface);
    // Axis names and tick labels are drawn in the theme's text colours.
    expect(pixels[system.onSurface] ?? 0, `${label}: on-surface text`).toBeGreaterThan(0);
    expect(pixels[system.onSurfaceVariant] ?? 0, `${label}: tick labels`).toBeGreaterThan(0);
    const drawn = Object.entries(pixels).filter(([colour, count]) => count >= 30 && colour !== system.outlineVariant);
    for (const [colour] of drawn) {
      expect(contrast(colour, background), `${label}: ${colour} on ${background}`).toBeGreaterThanOrEqual(3);
    }
  }
  for (const text of [system.onSurface, system.onSurfaceVariant]) expect(contrast(text, system.surface)).toBeGreaterThanOrEqual(4.5);
  const frequency = charts.find((c) => c.label.startsWith('Total, copper and core loss'))!;
  expect(frequency.pixels[system.primary] ?? 0, 'copper loss line in primary').toBeGreaterThan(50);
  expect(frequency.pixels[system.tertiary] ?? 0, 'core loss line in tertiary').toBeGreaterThan(50);
}

/** The design panel's charts and the operating point's chart as pictures (test artifacts). */
async function shoot(page: Page, theme: string): Promise<void> {
  // Tall enough for the whole chart column to be on screen, clear of the sticky toolbar.
  await page.setViewportSize({ width: 1280, height: 2400 });
  await page.locator('gw-design-panel .gw-charts').scrollIntoViewIfNeeded();
  await page.locator('gw-design-panel .gw-charts').screenshot({ path: screenshotPath(`chart-themes-${theme}-design`) });
  await page.locator('gw-operating-point-panel .gw-chart').screenshot({ path: screenshotPath(`chart-themes-${theme}-operating-point`) });
}

describe('chart themes', () => {
  it('draws the design page charts in the light theme and draws them again in the dark one, readable in both', async () => {
    const designId = await seededDesignId();
    const { context, page } = await h.newPage();
    await page.addInitScript(() => localStorage.setItem('gapwright.theme', 'light'));
    await signIn(page, erin.username, erin.password);
    await page.goto(`/designs/${designId}`);
    const charts = page.locator('gw-design-panel .gw-chart canvas, gw-operating-point-panel .gw-chart canvas');
    await expect.poll(() => charts.count(), { timeout: 30_000 }).toBeGreaterThanOrEqual(5);
    // Let the sweeps arrive and each chart finish drawing.
    await page.locator('gw-design-panel .gw-chart[aria-label^="Total, copper and core loss"] canvas').waitFor();
    await page.waitForTimeout(500);

    const light = await sample(page);
    expectReadable(light);
    await shoot(page, 'light');

    await page.getByRole('button', { name: 'Switch to dark theme' }).click();
    await page.getByRole('button', { name: 'Switch to light theme' }).waitFor();
    // The canvases are drawn again in the dark theme's colours without a reload.
    await expect.poll(async () => (await sample(page)).charts[0]!.pixels[light.system.onSurface] ?? 0).toBe(0);
    const dark = await sample(page);
    expectReadable(dark);
    await shoot(page, 'dark');
    expect(await seriousAxeFindings(page)).toEqual([]);

    for (const key of ['surface', 'onSurface', 'onSurfaceVariant', 'primary', 'tertiary'] as const) {
      expect(dark.system[key], key).not.toBe(light.system[key]);
    }
    // No light colour is left on a dark canvas (light on-surface-variant is dark outline-variant: one tone, both uses).
    const leftOver = (['onSurface', 'onSurfaceVariant', 'primary', 'tertiary'] as const).filter(
      (key) => !Object.values(dark.system).includes(light.system[key]),
    );
    expect(leftOver.length).toBeGreaterThanOrEqual(3);
    for (const chart of dark.charts) {
      for (const key of leftOver) {
        expect(chart.pixels[light.system[key]] ?? 0, `${chart.label}: light ${key} left in the dark theme`).toBe(0);
      }
    }
    await context.close();
  });
});
