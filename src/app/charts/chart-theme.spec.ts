import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { Theme } from '@shared/schemas/auth';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { ThemeSwitcher } from '../core/theme-switcher';
import {
  ChartThemes,
  FALLBACK_COLOURS,
  chartTheme,
  contrastRatio,
  pickScheme,
  readSystemColours,
  themed,
  toHex,
  type SystemColours,
} from './chart-theme';

// Made-up colours, each different, so a test can tell which CSS variable (and which half of it) was read.
const CSS_LIGHT: SystemColours = {
  surface: '#fefefe',
  onSurface: '#101010',
  onSurfaceVariant: '#202020',
  outline: '#303030',
  outlineVariant: '#404040',
  surfaceContainerHigh: '#505050',
  primary: '#600000',
  tertiary: '#006000',
  error: '#000060',
};
const CSS_DARK: SystemColours = {
  surface: '#010101',
  onSurface: '#efefef',
  onSurfaceVariant: '#dfdfdf',
  outline: '#cfcfcf',
  outlineVariant: '#bfbfbf',
  surfaceContainerHigh: '#afafaf',
  primary: '#ff9f9f',
  tertiary: '#9fff9f',
  error: '#9f9fff',
};
const kebab = (key: string) => key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);

/** A stylesheet written the way `mat.theme` writes the system colours: `light-dark(light, dark)` on <html>. */
function installThemeCss(): HTMLStyleElement {
  const style = document.createElement('style');
  const lines = Object.keys(CSS_LIGHT).map((key) => {
    const k = key as keyof SystemColours;
    return `--mat-sys-${kebab(k)}: light-dark(${CSS_LIGHT[k]}, ${CSS_DARK[k]});`;
  });
  style.textContent = `html { ${lines.join(' ')} }`;
  document.head.appendChild(style);
  return style;
}

describe('chart theme', () => {
  let style: HTMLStyleElement | null = null;
  afterEach(() => {
    style?.remove();
    style = null;
  });

  it('reads each Material system colour from its CSS variable, the light half for light and the dark half for dark', () => {
    style = installThemeCss();

    expect(readSystemColours(document, 'light')).toEqual(CSS_LIGHT);
    expect(readSystemColours(document, 'dark')).toEqual(CSS_DARK);
  });

  it("falls back to the palette's own tones where the theme's CSS is not loaded", () => {
    expect(readSystemColours(document, 'dark')).toEqual(FALLBACK_COLOURS.dark);
  });

  it('gives text, secondary text, axes, grid lines, tooltip and the first series colours from the system colours', () => {
    const theme = chartTheme(CSS_DARK, 'dark');

    expect(theme).toMatchObject({
      scheme: 'dark',
      surface: '#010101',
      text: '#efefef',
      secondaryText: '#dfdfdf',
      axisLine: '#cfcfcf',
      gridLine: '#bfbfbf',
      tooltipBackground: '#afafaf',
      error: '#9f9fff',
    });
    expect(theme.series.slice(0, 2)).toEqual(['#ff9f9f', '#9fff9f']);
    expect(new Set(theme.series).size).toBe(theme.series.length);
  });

  it('takes one half of light-dark() and reads the colour notations Material and browsers write', () => {
    expect(pickScheme('light-dark(#944a15, #ffb68c)', 'light')).toBe('#944a15');
    expect(pickScheme(' light-dark(#944a15, #ffb68c) ', 'dark')).toBe('#ffb68c');
    expect(pickScheme('#123456', 'dark')).toBe('#123456');
    expect(toHex('#AbC')).toBe('#aabbcc');
    expect(toHex('rgb(255, 182, 140)')).toBe('#ffb68c');
    expect(toHex('rgba(0, 106, 100, 1)')).toBe('#006a64');
    expect(toHex('rgba(0, 106, 100, 0.5)')).toBeNull();
    expect(toHex('')).toBeNull();
  });
});

describe('contrast of the chart colours (WCAG 2.1)', () => {
  it('computes the contrast ratio as WCAG 2.1 defines it', () => {
    // WCAG 2.1, "contrast ratio": black on white is the maximum, 21:1; a colour against itself is 1:1.
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrastRatio('#ffffff', '#000000')).toBeCloseTo(21, 6);
    expect(contrastRatio('#19120e', '#19120e')).toBe(1);
    // #767676 on white, 4.54:1: the lightest grey usually quoted as passing 4.5:1 (from memory).
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
  });

  for (const scheme of ['light', 'dark'] as Theme[]) {
    describe(scheme, () => {
      const theme = chartTheme(FALLBACK_COLOURS[scheme], scheme);
      const backgrounds = [FALLBACK_COLOURS[scheme].surface, FALLBACK_COLOURS[scheme].surfaceContainerHigh];

      it('keeps text at 4.5:1 or more against the surface and inside the tooltip (WCAG 2.1 SC 1.4.3)', () => {
        for (const text of [theme.text, theme.secondaryText]) {
          expect(contrastRatio(text, theme.surface)).toBeGreaterThanOrEqual(4.5);
          expect(contrastRatio(text, theme.tooltipBackground)).toBeGreaterThanOrEqual(4.5);
        }
      });

      it('keeps every series colour, the error marks and the axis lines at 3:1 or more (WCAG 2.1 SC 1.4.11)', () => {
        for (const colour of [...theme.series, theme.error, theme.axisLine]) {
          for (const background of backgrounds) expect(contrastRatio(colour, background)).toBeGreaterThanOrEqual(3);
        }
      });

      it('keeps grid lines subtle: below the axis lines against the surface', () => {
        expect(contrastRatio(theme.gridLine, theme.surface)).toBeLessThan(contrastRatio(theme.axisLine, theme.surface));
      });
    });
  }
});

describe('themed()', () => {
  const theme = chartTheme(FALLBACK_COLOURS.dark, 'dark');

  it('lays the theme under every axis, the legend, the tooltip and the palette', () => {
    const options = themed(
      {
        legend: { top: 0 },
        tooltip: { trigger: 'axis' },
        grid: { left: 56 },
        xAxis: { type: 'value', name: '% load' },
        yAxis: [
          { type: 'value', name: 'W' },
          { type: 'value', name: '% of Pout', splitLine: { show: false } },
        ],
        series: [{ type: 'bar', label: { show: true } }],
      },
      theme,
    ) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

    expect(options['color']).toEqual(theme.series);
    expect(options['textStyle'].color).toBe(theme.text);
    expect(options['legend']).toMatchObject({ top: 0, textStyle: { color: theme.text } });
    expect(options['tooltip']).toMatchObject({ trigger: 'axis', backgroundColor: theme.tooltipBackground });
    expect(options['grid']).toMatchObject({ left: 56, outerBounds: { left: 4, right: 4, top: 4, bottom: 4 } });
    expect(options['xAxis']).toMatchObject({
      name: '% load',
      nameTextStyle: { color: theme.text },
      axisLabel: { color: theme.secondaryText },
    });
    expect(options['yAxis']).toHaveLength(2);
    expect(options['yAxis'][1]).toMatchObject({ splitLine: { show: false, lineStyle: { color: theme.gridLine } } });
    expect(options['yAxis'][0].axisLine.lineStyle.color).toBe(theme.axisLine);
    expect(options['series'][0].label).toEqual({ show: true, color: theme.text });
    expect(options['series'][0].markLine).toBeUndefined();
  });

  it('draws hollow symbols filled with the surface and ringed in their colour, and lines with solid markers', () => {
    const options = themed(
      {
        series: [
          { type: 'line', name: 'Front', data: [{ value: [1, 2] }, { value: [2, 1], symbol: 'emptyDiamond' }] },
          { type: 'scatter', name: 'DCM', symbol: 'emptyCircle', itemStyle: { color: '#123456' }, data: [[1, 2]] },
          { type: 'line', name: 'Front', data: [] },
        ],
      },
      theme,
    ) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

    const [front, dcm, sameName] = options['series'];
    expect(front.symbol).toBe('circle');
    expect(front.data[1]).toEqual({
      value: [2, 1],
      symbol: 'diamond',
      itemStyle: { color: theme.surface, borderColor: theme.series[0], borderWidth: 2 },
    });
    expect(dcm).toMatchObject({ symbol: 'circle', itemStyle: { color: theme.surface, borderColor: '#123456', borderWidth: 2 } });
    expect(sameName.symbol).toBe('circle');
  });

  it("keeps what a chart sets itself and leaves an empty chart's options empty", () => {
    const options = themed({ color: ['#010203'], xAxis: { axisLabel: { color: '#445566' } } }, theme) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

    expect(options['color']).toEqual(['#010203']);
    expect(options['xAxis'].axisLabel.color).toBe('#445566');
    expect(themed({}, theme)).toEqual({});
  });
});

describe('ChartThemes', () => {
  let style: HTMLStyleElement;
  beforeEach(() => {
    localStorage.setItem('gapwright.theme', 'light');
    style = installThemeCss();
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
  });
  afterEach(() => {
    style.remove();
    localStorage.clear();
    document.documentElement.classList.remove('gw-theme-light', 'gw-theme-dark');
  });

  it('follows the theme toggle', () => {
    const current = TestBed.inject(ChartThemes).current;
    expect(current()).toMatchObject({ scheme: 'light', text: CSS_LIGHT.onSurface, surface: CSS_LIGHT.surface });

    TestBed.inject(ThemeSwitcher).toggle();

    expect(current()).toMatchObject({ scheme: 'dark', text: CSS_DARK.onSurface, surface: CSS_DARK.surface });
  });
});
