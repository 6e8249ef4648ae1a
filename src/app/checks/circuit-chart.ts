import type { CircuitCorner } from '@shared/schemas/checks';
import type { EChartsCoreOption } from 'echarts/core';

import { themed, type ChartTheme } from '../charts/chart-theme';

/** Simulated and predicted inductor current over one period: time in µs, current in A. */
export function circuitChartOptions(corner: CircuitCorner, theme: ChartTheme): EChartsCoreOption {
  const us = (points: [number, number][]) => points.map(([t, i]) => [t * 1e6, i]);
  const period = corner.waveform.predicted.at(-1)?.[0] ?? 0;
  return themed(
    {
      animation: false,
      grid: { left: 52, right: 16, top: 32, bottom: 40 },
      legend: { top: 0 },
      tooltip: { trigger: 'axis', valueFormatter: (v: number) => `${v.toFixed(3)} A` },
      xAxis: { type: 'value', name: 'Time (µs)', nameLocation: 'middle', nameGap: 26, min: 0, max: period * 1e6 },
      yAxis: { type: 'value', name: 'Inductor current (A)', nameLocation: 'middle', nameGap: 40, scale: true },
      series: [
        { type: 'line', name: 'Simulated (ngspice)', data: us(corner.waveform.simulated), showSymbol: false },
        { type: 'line', name: 'Predicted (engine)', data: us(corner.waveform.predicted), showSymbol: false, lineStyle: { type: 'dashed' } },
      ],
    },
    theme,
  );
}

/** A short description of the chart for screen readers. */
export function circuitChartLabel(corner: CircuitCorner): string {
  const a = (x: number) => `${x.toFixed(2)} A`;
  return `${corner.label}: simulated peak ${a(corner.simulated.peak)} and ripple ${a(corner.simulated.ripple)}; predicted peak ${a(corner.predicted.peak)} and ripple ${a(corner.predicted.ripple)}`;
}
