import type { EChartsCoreOption } from 'echarts/core';

import { tooltipLines } from '../charts/chart-text';
import { themed, type ChartTheme } from '../charts/chart-theme';
import type { CandidateRow } from './candidate-rows';
import { axisIn, type AxisScale } from '@shared/units/index';

/** The size the Pareto chart plots loss against: core volume (cm³) or the part's mass, core plus copper (g). */
export type FrontBy = 'volume' | 'mass';

export const SIZE_AXES: Record<FrontBy, AxisScale & { name: string }> = {
  volume: { ...axisIn('cm³'), name: 'Core volume' },
  mass: { ...axisIn('g'), name: 'Mass, core and copper' },
};

/** The front series comes first, so a point's screen position is found with `seriesIndex: FRONT_SERIES`. */
export const FRONT_SERIES = 0;

export const EXTRAPOLATED_LEGEND = 'Extrapolated loss data (hollow)';

export interface CandidatesChartInput {
  /** The whole Pareto front for `by`, as the server sends it. */
  front: readonly CandidateRow[];
  /** The candidates of the page shown in the table. */
  page: readonly CandidateRow[];
  by: FrontBy;
  selected: CandidateRow | null;
}

interface Point {
  value: [number, number];
  name: string;
  key: string;
  rank: number;
  extrapolated: boolean;
  symbol?: string;
}

/** The chart coordinates of a candidate: size in the axis unit, total loss in W. */
export function pointOf(row: CandidateRow, by: FrontBy): [number, number] {
  return [SIZE_AXES[by].toAxis(by === 'volume' ? row.volume : row.mass), row.totalLoss];
}

/**
 * Loss against core volume or mass: the whole Pareto front joined by a line, the page's candidates as points, those on
 * extrapolated loss data hollow, the selected one ringed.
 */
export function candidatesChartOptions({ front, page, by, selected }: CandidatesChartInput, theme: ChartTheme): EChartsCoreOption {
  if (!front.length && !page.length) return {};
  const axis = SIZE_AXES[by];
  const point = (r: CandidateRow, hollow: string): Point => ({
    value: pointOf(r, by),
    name: r.label,
    key: r.key,
    rank: r.rank,
    extrapolated: r.extrapolated,
    ...(r.extrapolated ? { symbol: hollow } : {}),
  });
  const ordered = [...front].sort((a, b) => pointOf(a, by)[0] - pointOf(b, by)[0]);
  return themed(
    {
      animation: false,
      grid: { left: 56, right: 24, top: 40, bottom: 44 },
      legend: { top: 0 },
      tooltip: { trigger: 'item', formatter: (p: TooltipPoint) => candidateTooltip(p, axis.unit) },
      // Log: the front spans two decades of size, and the small end, where the choice is made, would be crushed.
      xAxis: {
        type: 'log',
        name: `${axis.name} (${axis.unit})`,
        nameLocation: 'middle',
        nameGap: 28,
        min: (range: { min: number }) => roundNumber(range.min, 'down'),
        max: (range: { max: number }) => roundNumber(range.max, 'up'),
        axisLabel: { formatter: (value: number) => String(Number(value.toPrecision(3))) },
      },
      yAxis: { type: 'value', name: 'Total loss (W)', scale: true },
      series: [
        {
          type: 'line',
          name: `Pareto front (${by === 'volume' ? 'loss vs core volume' : 'loss vs mass'})`,
          data: ordered.map((r) => point(r, 'emptyDiamond')),
          symbol: 'diamond',
          symbolSize: 11,
          z: 3,
        },
        { type: 'scatter', name: 'This page', data: page.filter((r) => !r.extrapolated).map((r) => point(r, 'circle')), symbolSize: 8 },
        {
          type: 'scatter',
          name: EXTRAPOLATED_LEGEND,
          data: page.filter((r) => r.extrapolated).map((r) => point(r, 'emptyCircle')),
          symbol: 'emptyCircle',
          symbolSize: 8,
        },
        {
          type: 'scatter',
          name: 'Selected',
          data: selected ? [point(selected, 'circle')] : [],
          symbolSize: 20,
          symbol: 'circle',
          itemStyle: { color: 'transparent', borderWidth: 3, borderColor: theme.error },
          silent: true,
          z: 5,
        },
      ],
    },
    theme,
  );
}

/** The nearest of 1, 2, 5 × 10ⁿ below or above `value`: round ends for a log axis whose ticks fall on decades. */
export function roundNumber(value: number, way: 'down' | 'up'): number {
  const decade = 10 ** Math.floor(Math.log10(value));
  const steps = way === 'down' ? [5, 2, 1] : [1, 2, 5, 10];
  const found = steps.find((step) => (way === 'down' ? step * decade <= value : step * decade >= value))!;
  return Number((found * decade).toPrecision(1));
}

export interface TooltipPoint {
  name: string;
  value: number[];
  data?: { rank?: number; extrapolated?: boolean };
}

/** The tooltip of one point: its core · material · wire name as text, then loss and size, rank and data warning. */
export function candidateTooltip(p: TooltipPoint, unit: string): string {
  const rank = p.data?.rank ? `Rank ${p.data.rank}` : '';
  const data = p.data?.extrapolated ? 'core loss from extrapolated data' : '';
  const notes = [rank, data].filter(Boolean).join(' · ');
  return tooltipLines(p.name, `${p.value[1].toFixed(3)} W, ${p.value[0].toFixed(2)} ${unit}`, ...(notes ? [notes] : []));
}
