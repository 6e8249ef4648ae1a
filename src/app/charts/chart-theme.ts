// Every chart's colours come from here: the Material 3 system colours of the scheme in use (read from the CSS
// variables `mat.theme` puts on <html>) and a series palette of our own tones, chosen like Material's own pairs
// (tone 40 on the light surface, tone 80 on the dark one). `themed()` lays them under a chart's options.
import { DOCUMENT, Injectable, computed, inject } from '@angular/core';
import type { Theme } from '@shared/schemas/auth';
import type { EChartsCoreOption } from 'echarts/core';

import { ThemeSwitcher } from '../core/theme-switcher';

/** The Material system colours the charts use, as `#rrggbb`. */
export interface SystemColours {
  surface: string;
  onSurface: string;
  onSurfaceVariant: string;
  outline: string;
  outlineVariant: string;
  surfaceContainerHigh: string;
  primary: string;
  tertiary: string;
  error: string;
}

const TOKENS: Record<keyof SystemColours, string> = {
  surface: '--mat-sys-surface',
  onSurface: '--mat-sys-on-surface',
  onSurfaceVariant: '--mat-sys-on-surface-variant',
  outline: '--mat-sys-outline',
  outlineVariant: '--mat-sys-outline-variant',
  surfaceContainerHigh: '--mat-sys-surface-container-high',
  primary: '--mat-sys-primary',
  tertiary: '--mat-sys-tertiary',
  error: '--mat-sys-error',
};

/**
 * The system colours of `src/styles/_palette.scss` (Material's light tones 98/10/30/50/80/92/40 and dark tones
 * 6/90/90/60/30/17/80), used only where the theme's CSS is not loaded (component specs).
 */
export const FALLBACK_COLOURS: Record<Theme, SystemColours> = {
  light: {
    surface: '#fff8f5',
    onSurface: '#221a15',
    onSurfaceVariant: '#54433a',
    outline: '#877368',
    outlineVariant: '#dac2b5',
    surfaceContainerHigh: '#f5e5dd',
    primary: '#944a15',
    tertiary: '#006a64',
    error: '#ba1a1a',
  },
  dark: {
    surface: '#19120e',
    onSurface: '#f0dfd8',
    onSurfaceVariant: '#f7ddd1',
    outline: '#a28c81',
    outlineVariant: '#54433a',
    surfaceContainerHigh: '#312823',
    primary: '#ffb68c',
    tertiary: '#83d5cd',
    error: '#ffb4ab',
  },
};

/** Series colours beyond Material's primary and tertiary: blue, amber, violet, green, magenta, slate. */
export const OWN_SERIES: Record<Theme, readonly string[]> = {
  light: ['#3f5aa9', '#7a5900', '#7a4aa8', '#3b6a1f', '#a0306e', '#4f5b66'],
  dark: ['#b1c5ff', '#f5bf48', '#dcb8ff', '#a6d68a', '#ffb0cf', '#bcc8d4'],
};

/** What a chart is drawn with in one scheme. */
export interface ChartTheme {
  scheme: Theme;
  /** The page behind the (transparent) canvas. */
  surface: string;
  /** Titles, legend, axis names, value labels. */
  text: string;
  /** Tick labels and other secondary text. */
  secondaryText: string;
  /** Axis lines and ticks. */
  axisLine: string;
  /** Grid (split) lines: subtle in both schemes. */
  gridLine: string;
  tooltipBackground: string;
  /** Series colours in order: primary, tertiary, then our own tones. */
  series: readonly string[];
  /** Failure marks: saturation, infeasible points, the selected candidate's ring. */
  error: string;
}

export function chartTheme(colours: SystemColours, scheme: Theme): ChartTheme {
  return {
    scheme,
    surface: colours.surface,
    text: colours.onSurface,
    secondaryText: colours.onSurfaceVariant,
    axisLine: colours.outline,
    gridLine: colours.outlineVariant,
    tooltipBackground: colours.surfaceContainerHigh,
    series: [colours.primary, colours.tertiary, ...OWN_SERIES[scheme]],
    error: colours.error,
  };
}

/**
 * The system colours of `scheme` as the page's CSS defines them. Material writes each as `light-dark(a, b)`; the
 * half for the scheme is taken here rather than left to the browser, so the answer does not depend on when the
 * toggle's class reaches <html>. A token that is missing or not a plain colour keeps its fallback.
 */
export function readSystemColours(doc: Document, scheme: Theme): SystemColours {
  const style = doc.defaultView?.getComputedStyle(doc.documentElement);
  const entries = Object.entries(TOKENS).map(([key, token]) => {
    const value = pickScheme(style?.getPropertyValue(token) ?? '', scheme);
    return [key, toHex(value) ?? FALLBACK_COLOURS[scheme][key as keyof SystemColours]];
  });
  return Object.fromEntries(entries) as SystemColours;
}

/** `light-dark(a, b)` → a or b; anything else as it is. */
export function pickScheme(value: string, scheme: Theme): string {
  const pair = /^\s*light-dark\(\s*([^,]+?)\s*,\s*([^)]+?\)?)\s*\)\s*$/.exec(value);
  if (!pair) return value.trim();
  return scheme === 'light' ? pair[1]! : pair[2]!;
}

/** `#rgb`, `#rrggbb` or `rgb(r, g, b)` as `#rrggbb`; null for anything else. */
export function toHex(colour: string): string | null {
  const text = colour.trim().toLowerCase();
  const short = /^#([0-9a-f])([0-9a-f])([0-9a-f])$/.exec(text);
  if (short) return `#${short[1]}${short[1]}${short[2]}${short[2]}${short[3]}${short[3]}`;
  if (/^#[0-9a-f]{6}$/.test(text)) return text;
  const rgb = /^rgba?\(\s*(\d+)[\s,]+(\d+)[\s,]+(\d+)\s*(?:[,/]\s*1(?:\.0*)?\s*)?\)$/.exec(text);
  if (!rgb) return null;
  return `#${rgb
    .slice(1, 4)
    .map((c) => Number(c).toString(16).padStart(2, '0'))
    .join('')}`;
}

/** WCAG 2.1 relative luminance of a `#rrggbb` colour (definition "relative luminance", sRGB). */
export function relativeLuminance(hex: string): number {
  const channel = (i: number) => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2);
}

/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05), lighter over darker: 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (light! + 0.05) / (dark! + 0.05);
}

/** The chart theme of the scheme in use, recomputed when the toggle (or the operating system) changes it. */
@Injectable({ providedIn: 'root' })
export class ChartThemes {
  private readonly document = inject(DOCUMENT);
  private readonly switcher = inject(ThemeSwitcher);

  readonly current = computed(() => {
    const scheme = this.switcher.theme();
    return chartTheme(readSystemColours(this.document, scheme), scheme);
  });
}

type Options = Record<string, unknown>;
const isPlain = (value: unknown): value is Options =>
  typeof value === 'object' && value !== null && !Array.isArray(value) && Object.getPrototypeOf(value) === Object.prototype;

/** `given` laid over `defaults`: plain objects merged key by key, anything else from `given` where it is set. */
function over(defaults: Options, given: unknown): Options {
  if (!isPlain(given)) return defaults;
  const merged: Options = { ...defaults };
  for (const [key, value] of Object.entries(given)) {
    merged[key] = isPlain(value) && isPlain(defaults[key]) ? over(defaults[key], value) : value;
  }
  return merged;
}
const eachOver = (defaults: Options, given: unknown) =>
  Array.isArray(given) ? given.map((g) => over(defaults, g)) : over(defaults, given);

/**
 * The colour echarts gives each series: its own item or line colour, else the palette's next colour by series name
 * (series of one name share a colour).
 */
function seriesColours(series: unknown, palette: readonly string[]): string[] {
  if (!Array.isArray(series)) return [];
  const byName = new Map<unknown, string>();
  return series.map((s: unknown) => {
    const own = isPlain(s)
      ? ((s['itemStyle'] as Options | undefined)?.['color'] ?? (s['lineStyle'] as Options | undefined)?.['color'])
      : null;
    if (typeof own === 'string') return own;
    const name = isPlain(s) ? s['name'] : undefined;
    if (!byName.has(name)) byName.set(name, palette[byName.size % palette.length]!);
    return byName.get(name)!;
  });
}

/**
 * An item (series or data point) with a hollow symbol ('emptyCircle', 'emptyDiamond'…) drawn as the filled shape in
 * the page's surface colour, ringed in its colour: echarts fills hollow symbols white whatever the scheme.
 */
function hollowed<T>(item: T, colour: string, surface: string): T {
  if (!isPlain(item) || typeof item['symbol'] !== 'string' || !item['symbol'].startsWith('empty')) return item;
  const shape = item['symbol'].slice('empty'.length);
  const style = isPlain(item['itemStyle']) ? item['itemStyle'] : {};
  return {
    ...(item as Options),
    symbol: shape.charAt(0).toLowerCase() + shape.slice(1),
    itemStyle: { borderWidth: 2, ...style, color: surface, borderColor: style['color'] ?? colour },
  } as T;
}

/**
 * A chart's options with the theme underneath: text, axes, grid lines, legend, tooltip and the series palette from
 * `theme`, whatever the chart sets itself kept; hollow symbols filled with the surface colour. Axis names and tick labels are kept inside the canvas (echarts'
 * outer bounds), so short unit names such as "W" above an axis are never cut off. Empty options stay empty.
 */
export function themed(options: EChartsCoreOption, theme: ChartTheme): EChartsCoreOption {
  if (!Object.keys(options).length) return options;
  const o = options as Options;
  const text = { color: theme.text };
  const axis = {
    nameTextStyle: text,
    axisLine: { lineStyle: { color: theme.axisLine } },
    axisTick: { lineStyle: { color: theme.axisLine } },
    axisLabel: { color: theme.secondaryText },
    splitLine: { lineStyle: { color: theme.gridLine } },
  };
  const palette = (o['color'] as readonly string[] | undefined) ?? theme.series;
  const colourOf = seriesColours(o['series'], palette);
  const seriesThemed = (series: unknown, i: number) => {
    if (!isPlain(series)) return series;
    const colour = colourOf[i]!;
    const defaults = {
      label: text,
      ...(series['markLine'] ? { markLine: { label: text } } : {}),
      // A line's own markers: echarts' default is a hollow circle filled white, glaring in the dark scheme.
      ...(series['type'] === 'line' ? { symbol: 'circle' } : {}),
    };
    const merged = hollowed(over(defaults, series), colour, theme.surface);
    const data = merged['data'];
    return Array.isArray(data) ? { ...merged, data: data.map((d: unknown) => hollowed(d, colour, theme.surface)) } : merged;
  };
  return {
    ...o,
    color: [...palette],
    textStyle: over({ ...text, fontFamily: "'Noto Sans', sans-serif" }, o['textStyle']),
    ...(o['title'] ? { title: eachOver({ textStyle: text, subtextStyle: { color: theme.secondaryText } }, o['title']) } : {}),
    ...(o['legend']
      ? {
          legend: eachOver(
            { textStyle: text, pageTextStyle: text, pageIconColor: theme.text, pageIconInactiveColor: theme.gridLine },
            o['legend'],
          ),
        }
      : {}),
    ...(o['tooltip']
      ? {
          tooltip: over({ backgroundColor: theme.tooltipBackground, borderColor: theme.axisLine, textStyle: text }, o['tooltip']),
        }
      : {}),
    ...(o['grid'] ? { grid: eachOver({ outerBounds: { left: 4, right: 4, top: 4, bottom: 4 } }, o['grid']) } : {}),
    ...(o['xAxis'] ? { xAxis: eachOver(axis, o['xAxis']) } : {}),
    ...(o['yAxis'] ? { yAxis: eachOver(axis, o['yAxis']) } : {}),
    ...(Array.isArray(o['series']) ? { series: o['series'].map(seriesThemed) } : {}),
  };
}
