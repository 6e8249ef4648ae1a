import type { EChartsCoreOption } from 'echarts/core';
import type { FitAnswer } from '@shared/schemas/loss-points';
import type { LossPoint } from '@shared/fitting/loss-points';

import { themed, type ChartTheme } from '../charts/chart-theme';

/** "100 kHz": the series name of one measured frequency. */
export const frequencyLabel = (hz: number) => `${Number((hz / 1000).toPrecision(4))} kHz`;

/** The measured frequencies, lowest first, each with its colour (points, curve and residuals of one frequency match). */
function frequencyColours(points: readonly LossPoint[], palette: readonly string[]): Map<number, string> {
  const frequencies = [...new Set(points.map((p) => p.frequency))].sort((a, b) => a - b);
  return new Map(frequencies.map((f, i) => [f, palette[i % palette.length]!]));
}

function axes(x: string, y: string, yType: 'log' | 'value') {
  const axis = (name: string, type: 'log' | 'value') => ({ type, name, nameLocation: 'middle', nameGap: 36 });
  return {
    grid: { left: 72, right: 24, top: 48, bottom: 56 },
    legend: { type: 'scroll', top: 0 },
    tooltip: { trigger: 'item' },
    xAxis: { ...axis(x, 'log'), min: 'dataMin', max: 'dataMax' },
    yAxis: axis(y, yType),
  };
}

/**
 * Measured points (markers) over the fitted curves (lines), log-log loss density in kW/m³ against peak flux
 * in mT, one series pair per frequency; a curve at another temperature than the first of its frequency is dashed.
 */
export function fitChartOptions(points: readonly LossPoint[], fit: FitAnswer, theme: ChartTheme): EChartsCoreOption {
  const colours = frequencyColours(points, theme.series);
  const measured = [...colours].map(([frequency, colour]) => ({
    name: frequencyLabel(frequency),
    type: 'scatter',
    symbolSize: 7,
    itemStyle: { color: colour },
    data: points.filter((p) => p.frequency === frequency).map((p) => [p.peakFlux * 1000, p.lossDensity / 1000]),
  }));
  const firstTemperature = new Map<number, number>();
  const curves = fit.curves.map((curve) => {
    const first = firstTemperature.get(curve.frequency) ?? curve.temperature;
    firstTemperature.set(curve.frequency, first);
    const colour = colours.get(curve.frequency) ?? theme.series[0];
    return {
      name: frequencyLabel(curve.frequency),
      type: 'line',
      showSymbol: false,
      lineStyle: { width: 2, color: colour, type: curve.temperature === first ? 'solid' : 'dashed' },
      itemStyle: { color: colour },
      data: curve.samples.map((s) => [s.peakFlux * 1000, s.lossDensity / 1000]),
    };
  });
  return themed({ ...axes('Peak flux density B̂ (mT)', 'Loss density (kW/m³)', 'log'), series: [...measured, ...curves] }, theme);
}

/** Relative error of the fitted model at each point used (%), against peak flux in mT, one series per frequency. */
export function residualChartOptions(points: readonly LossPoint[], fit: FitAnswer, theme: ChartTheme): EChartsCoreOption {
  const colours = frequencyColours(points, theme.series);
  const series = [...colours].map(([frequency, colour]) => ({
    name: frequencyLabel(frequency),
    type: 'scatter',
    symbolSize: 7,
    itemStyle: { color: colour },
    data: fit.residuals
      .filter((r) => points[r.index]?.frequency === frequency)
      .map((r) => [points[r.index].peakFlux * 1000, r.relativeError * 100]),
  }));
  return themed({ ...axes('Peak flux density B̂ (mT)', 'Relative error (%)', 'value'), series }, theme);
}
