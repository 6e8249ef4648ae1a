import { describe, expect, it } from 'vitest';

import { fitChartOptions, frequencyLabel, residualChartOptions } from './fit-chart-options';
import { FIT, POINTS } from './fit-fixture';
import { FALLBACK_COLOURS, chartTheme } from '../charts/chart-theme';

const LIGHT = chartTheme(FALLBACK_COLOURS.light, 'light');

interface Series {
  name: string;
  type: string;
  data: number[][];
  itemStyle: { color: string };
  lineStyle?: { type: string };
}
const seriesOf = (options: unknown) => (options as { series: Series[] }).series;

describe('fitChartOptions', () => {
  it('draws the measured points as markers and the fitted curve as a line for each frequency, in mT and kW/m³', () => {
    const series = seriesOf(fitChartOptions(POINTS, FIT, LIGHT));
    const scatter = series.filter((s) => s.type === 'scatter');
    const lines = series.filter((s) => s.type === 'line');

    expect(scatter.map((s) => s.name)).toEqual(['100 kHz', '200 kHz']);
    expect(lines.map((s) => s.name)).toEqual(['100 kHz', '200 kHz']);
    expect(scatter[0].data).toEqual([
      [50, 20],
      [100, 90],
    ]);
    expect(lines[1].data).toEqual([
      [50, 51],
      [100, 200],
    ]);
    // A frequency's points and curve share one colour; the two frequencies differ.
    expect(lines[0].itemStyle.color).toBe(scatter[0].itemStyle.color);
    expect(scatter[1].itemStyle.color).not.toBe(scatter[0].itemStyle.color);
  });

  it('draws both axes logarithmic', () => {
    const options = fitChartOptions(POINTS, FIT, chartTheme(FALLBACK_COLOURS.dark, 'dark')) as {
      xAxis: { type: string };
      yAxis: { type: string };
    };
    expect([options.xAxis.type, options.yAxis.type]).toEqual(['log', 'log']);
  });

  it('dashes a curve at a second temperature of the same frequency', () => {
    const hot = { ...FIT, curves: [...FIT.curves, { ...FIT.curves[0], temperature: 100 }] };
    const lines = seriesOf(fitChartOptions(POINTS, hot, LIGHT)).filter((s) => s.type === 'line');
    expect(lines.map((s) => s.lineStyle?.type)).toEqual(['solid', 'solid', 'dashed']);
  });
});

describe('residualChartOptions', () => {
  it('plots each point’s relative error in percent against its peak flux, per frequency', () => {
    const series = seriesOf(residualChartOptions(POINTS, FIT, LIGHT));
    expect(series.map((s) => s.name)).toEqual(['100 kHz', '200 kHz']);
    expect(series[0].data).toEqual([
      [50, 5],
      [100, -8],
    ]);
    expect(series[1].data).toEqual([[50, 2]]);
  });
});

describe('frequencyLabel', () => {
  it('names a frequency in kHz', () => {
    expect(frequencyLabel(150e3)).toBe('150 kHz');
    expect(frequencyLabel(2500)).toBe('2.5 kHz');
  });
});
