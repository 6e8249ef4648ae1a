import type { LossMap } from '@shared/engine/load-map';
import type { EChartsCoreOption } from 'echarts/core';

import { themed, type ChartTheme } from '../charts/chart-theme';

const CORNERS = [
  { corner: 'min', label: 'Vin min' },
  { corner: 'nominal', label: 'Vin nominal' },
  { corner: 'max', label: 'Vin max' },
] as const;
export const DCM_LEGEND = 'Discontinuous conduction';

const percent = (fraction: number) => Math.round(fraction * 100);

/**
 * The loss map: the inductor's total loss (solid, left axis, W) and its share of the output power (dashed, right axis,
 * %) from 10 % to 100 % load, one colour per input voltage. Points in discontinuous conduction carry a hollow ring.
 */
export function loadMapChartOptions(map: LossMap | undefined, theme: ChartTheme): EChartsCoreOption {
  if (!map?.points.length) return {};
  const series: object[] = [];
  for (const [i, { corner, label }] of CORNERS.entries()) {
    const points = map.points.filter((p) => p.corner === corner);
    const style = { color: theme.series[i] };
    series.push(
      {
        type: 'line',
        name: `${label} loss`,
        data: points.map((p) => [percent(p.loadFraction), p.total]),
        itemStyle: style,
        lineStyle: style,
      },
      {
        type: 'line',
        name: `${label} share`,
        yAxisIndex: 1,
        data: points.map((p) => [percent(p.loadFraction), p.share * 100]),
        itemStyle: style,
        lineStyle: { ...style, type: 'dashed' },
        showSymbol: false,
      },
    );
  }
  const dcm = map.points.filter((p) => p.mode === 'dcm');
  if (dcm.length) {
    series.push({
      type: 'scatter',
      name: DCM_LEGEND,
      symbol: 'emptyCircle',
      symbolSize: 11,
      itemStyle: { color: theme.secondaryText, borderWidth: 2 },
      data: dcm.map((p) => [percent(p.loadFraction), p.total]),
    });
  }
  return themed(
    {
      animation: false,
      grid: { left: 56, right: 56, top: 64, bottom: 40 },
      legend: { top: 0 },
      tooltip: { trigger: 'axis' },
      xAxis: { type: 'value', name: '% load', nameLocation: 'middle', nameGap: 24, min: 10, max: 100 },
      yAxis: [
        { type: 'value', name: 'W' },
        { type: 'value', name: '% of Pout', splitLine: { show: false } },
      ],
      series,
    },
    theme,
  );
}

/** The chart's accessible description: the range of the share and where the converter leaves CCM. */
export function loadMapChartLabel(map: LossMap | undefined): string {
  if (!map?.points.length) return 'Loss map not computed';
  const shares = map.points.map((p) => p.share * 100);
  const base =
    `Inductor loss and its share of output power from 10 % to 100 % load at three input voltages; ` +
    `share ${Math.min(...shares).toFixed(2)} % to ${Math.max(...shares).toFixed(2)} %`;
  const dcm = map.points.filter((p) => p.mode === 'dcm');
  if (!dcm.length) return `${base}; continuous conduction throughout`;
  const upTo = CORNERS.flatMap(({ corner, label }) => {
    const loads = dcm.filter((p) => p.corner === corner).map((p) => percent(p.loadFraction));
    return loads.length ? [`up to ${Math.max(...loads)} % load at ${label}`] : [];
  });
  return `${base}; discontinuous conduction ${upTo.join(', ')}`;
}
