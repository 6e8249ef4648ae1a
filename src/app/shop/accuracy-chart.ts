import type { PredictionSample } from '@shared/schemas/shop';
import type { EChartsCoreOption } from 'echarts/core';

import { tooltipLines } from '../charts/chart-text';

/**
 * How each kind of unit is drawn: passing units as blue circles; failed units apart, as red-orange triangles, a shape
 * and a colour that do not read as "good" (and tell apart without colour).
 */
export const UNIT_MARKS = {
  passed: { name: 'Passed', symbol: 'circle', color: '#1565c0' },
  failed: { name: 'Failed (not a good unit)', symbol: 'triangle', color: '#d84315' },
} as const;

/** Scatter of measured/predicted inductance (x) against measured/predicted DCR (y); 1 is a perfect prediction. Voided records never reach it (the server leaves them out). */
export function accuracyChartOptions(units: readonly PredictionSample[]): EChartsCoreOption {
  const point = (u: PredictionSample) => ({
    value: [u.inductanceRatio, u.resistanceRatio],
    name: `${u.orderNumber} · ${u.designNumber} rev ${u.revision}`,
  });
  return {
    animation: false,
    title: { text: 'Measured ÷ predicted', left: 'center', textStyle: { fontSize: 14 } },
    tooltip: {
      trigger: 'item',
      formatter: (p: { name: string; value: [number, number] }) =>
        tooltipLines(p.name, `L ratio ${p.value[0].toFixed(3)}`, `DCR ratio ${p.value[1].toFixed(3)}`),
    },
    legend: { bottom: 0 },
    grid: { left: 64, right: 24, top: 40, bottom: 64 },
    xAxis: { type: 'value', name: 'Inductance, measured ÷ predicted', nameLocation: 'middle', nameGap: 28, scale: true },
    yAxis: { type: 'value', name: 'DCR at 20 °C, measured ÷ predicted', nameLocation: 'middle', nameGap: 44, scale: true },
    series: [
      {
        name: UNIT_MARKS.passed.name,
        type: 'scatter',
        symbol: UNIT_MARKS.passed.symbol,
        symbolSize: 10,
        itemStyle: { color: UNIT_MARKS.passed.color },
        data: units.filter((u) => u.passed).map(point),
        markLine: { silent: true, symbol: 'none', lineStyle: { type: 'dashed' }, data: [{ xAxis: 1 }, { yAxis: 1 }] },
      },
      {
        name: UNIT_MARKS.failed.name,
        type: 'scatter',
        symbol: UNIT_MARKS.failed.symbol,
        symbolSize: 13,
        itemStyle: { color: UNIT_MARKS.failed.color },
        data: units.filter((u) => !u.passed).map(point),
      },
    ],
  };
}
