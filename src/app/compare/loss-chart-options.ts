import type { EChartsCoreOption } from 'echarts/core';
import type { CurvePoint, MaterialCurves } from '@shared/schemas/compare';
import { formatIn } from '@shared/units/index';

import { splitByFlag } from '../charts/split-series';

export type LossMethod = 'igse' | 'steinmetz';
export type SweepAxis = 'frequency' | 'flux';

const PALETTE = [
  '#b5562b',
  '#00796b',
  '#5e35b1',
  '#c62828',
  '#2e7d32',
  '#1565c0',
  '#6d4c41',
  '#ad1457',
  '#f9a825',
  '#37474f',
  '#00838f',
  '#8e24aa',
];

/**
 * Split a curve into the fitted part (solid) and the extrapolated parts (dashed). Neighbouring points are
 * repeated so the two lines meet at the edge of the fitted range.
 */
export function splitByFit(
  points: readonly CurvePoint[],
  method: LossMethod,
): { fitted: ([number, number] | null)[]; extrapolated: ([number, number] | null)[] } {
  const { plain, flagged } = splitByFlag(points.map((p) => ({ x: p.x, y: p[method], flagged: p.extrapolated })));
  return { fitted: plain, extrapolated: flagged };
}

/** Log-log loss curves of several materials, fitted ranges solid and shaded, extrapolation dashed. */
export function lossChartOptions(
  materials: readonly MaterialCurves[],
  axis: SweepAxis,
  method: LossMethod,
  dark: boolean,
): EChartsCoreOption {
  const text = dark ? '#e6e1e5' : '#1d1b20';
  const grid = dark ? '#49454f' : '#cac4d0';
  const series = materials.flatMap((m, i) => {
    const colour = PALETTE[i % PALETTE.length];
    const { fitted, extrapolated } = splitByFit(axis === 'frequency' ? m.versusFrequency : m.versusFlux, method);
    const [from, to] = axis === 'frequency' ? [m.fit.frequencyMin, m.fit.frequencyMax] : [2 * m.fit.fluxMin || 1e-4, 2 * m.fit.fluxMax];
    return [
      {
        name: m.name,
        type: 'line',
        data: fitted,
        showSymbol: false,
        connectNulls: false,
        lineStyle: { width: 2.5, color: colour },
        itemStyle: { color: colour },
        markArea: { silent: true, itemStyle: { color: colour, opacity: 0.06 }, data: [[{ xAxis: from }, { xAxis: to }]] },
      },
      {
        name: m.name,
        type: 'line',
        data: extrapolated,
        showSymbol: false,
        connectNulls: false,
        lineStyle: { width: 1.5, type: 'dashed', color: colour },
        itemStyle: { color: colour },
        tooltip: { show: true },
      },
    ];
  });
  return {
    animation: false,
    color: PALETTE,
    textStyle: { color: text },
    legend: { top: 0, textStyle: { color: text }, type: 'plain' },
    tooltip: {
      trigger: 'axis',
      valueFormatter: (v: unknown) => (typeof v === 'number' ? formatIn(v, 'kW/m³', 3) : String(v)),
    },
    // Two legend entries fit on a line of a half-width chart; leave room for every line.
    grid: { left: 72, right: 24, top: 24 + 24 * Math.ceil(materials.length / 2), bottom: 56 },
    xAxis: {
      type: 'log',
      name: axis === 'frequency' ? 'Frequency (Hz)' : 'Peak-to-peak flux swing ΔB (T)',
      nameLocation: 'middle',
      nameGap: 32,
      axisLine: { lineStyle: { color: text } },
      axisLabel: { color: text },
      splitLine: { show: true, lineStyle: { color: grid } },
    },
    yAxis: {
      type: 'log',
      name: 'Core-loss density (W/m³)',
      nameLocation: 'middle',
      nameGap: 56,
      axisLine: { lineStyle: { color: text } },
      axisLabel: { color: text },
      splitLine: { show: true, lineStyle: { color: grid } },
    },
    series,
  };
}
