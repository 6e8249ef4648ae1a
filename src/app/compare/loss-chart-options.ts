import type { EChartsCoreOption } from 'echarts/core';
import type { LossPoint } from '@shared/fitting/loss-points';
import type { CurvePoint, MaterialCurves } from '@shared/schemas/compare';
import { axisIn, trimmedNumber, type AxisScale } from '@shared/units/index';

import { themed, type ChartTheme } from '../charts/chart-theme';
import { splitByFlag } from '../charts/split-series';
import type { DesignMark } from './design-mark';
import { pointsInSlice, type ChartSlice } from './loss-point-slice';

export type LossMethod = 'igse' | 'steinmetz';
export type SweepAxis = 'frequency' | 'flux';

/** The axes in the units the page's fields take: kHz and mT (ΔB), loss density in kW/m³. */
export const LOSS_AXIS = axisIn('kW/m³');
export const SWEEP_AXES: Record<SweepAxis, { scale: AxisScale; name: string }> = {
  frequency: { scale: axisIn('kHz'), name: 'Frequency (kHz)' },
  flux: { scale: axisIn('mT'), name: 'Peak-to-peak flux swing ΔB (mT)' },
};

/**
 * Split a curve into the fitted part (solid) and the extrapolated parts (dashed). Neighbouring points are
 * repeated so the two lines meet at the edge of the fitted range. x and y stay as the curve gives them (SI).
 */
export function splitByFit(
  points: readonly CurvePoint[],
  method: LossMethod,
): { fitted: ([number, number] | null)[]; extrapolated: ([number, number] | null)[] } {
  const { plain, flagged } = splitByFlag(points.map((p) => ({ x: p.x, y: p[method], flagged: p.extrapolated })));
  return { fitted: plain, extrapolated: flagged };
}

export interface LossChartInput {
  materials: readonly MaterialCurves[];
  axis: SweepAxis;
  method: LossMethod;
  theme: ChartTheme;
  /** Measured points of the drawn versions by material id, and where the chart cuts them; none drawn without both. */
  measured?: ReadonlyMap<string, readonly LossPoint[]>;
  slice?: ChartSlice | null;
  /** A saved design's operating point, marked with its own loss. */
  design?: DesignMark | null;
}

/** The point in the chart's units. */
function onAxes(axis: SweepAxis, [x, y]: readonly [number, number]): [number, number] {
  return [SWEEP_AXES[axis].scale.toAxis(x), LOSS_AXIS.toAxis(y)];
}
const scaled = (axis: SweepAxis, points: ([number, number] | null)[]) => points.map((p) => (p ? onAxes(axis, p) : null));

/** "GW-0012 r2: 100 kHz, B̂ 60 mT, 120 kW/m³ at 85 °C", the design mark's label. */
export function designLabel(design: DesignMark, method: LossMethod): string {
  const frequency = trimmedNumber(SWEEP_AXES.frequency.scale.toAxis(design.frequency), 4);
  const peak = trimmedNumber(SWEEP_AXES.flux.scale.toAxis(design.deltaB / 2), 3);
  const loss = trimmedNumber(LOSS_AXIS.toAxis(design[method]), 3);
  return `${design.label}: ${frequency} kHz, B̂ ${peak} mT, ${loss} kW/m³ at ${trimmedNumber(design.temperature, 3)} °C`;
}

/**
 * Log-log loss curves of several materials: fitted ranges solid and outlined by a dashed box (no fill, so the
 * ranges of several materials stay readable where they overlap), extrapolation dashed, measured points at the chart's
 * slice as marks in the material's colour, and a chosen design's operating point.
 */
export function lossChartOptions({ materials, axis, method, theme, measured, slice, design }: LossChartInput): EChartsCoreOption {
  const text = theme.text;
  const sweep = SWEEP_AXES[axis];
  const series: Record<string, unknown>[] = materials.flatMap((m, i) => {
    const colour = theme.series[i % theme.series.length];
    const { fitted, extrapolated } = splitByFit(axis === 'frequency' ? m.versusFrequency : m.versusFlux, method);
    const [from, to] = axis === 'frequency' ? [m.fit.frequencyMin, m.fit.frequencyMax] : [2 * m.fit.fluxMin || 1e-4, 2 * m.fit.fluxMax];
    const points = measured && slice ? pointsInSlice(measured.get(m.id) ?? [], axis, slice) : [];
    return [
      {
        name: m.name,
        type: 'line',
        data: scaled(axis, fitted),
        showSymbol: false,
        connectNulls: false,
        lineStyle: { width: 2.5, color: colour },
        itemStyle: { color: colour },
        markArea: {
          silent: true,
          itemStyle: { color: 'transparent', borderColor: colour, borderWidth: 1, borderType: 'dashed' },
          data: [[{ xAxis: sweep.scale.toAxis(from) }, { xAxis: sweep.scale.toAxis(to) }]],
        },
      },
      {
        name: m.name,
        type: 'line',
        data: scaled(axis, extrapolated),
        showSymbol: false,
        connectNulls: false,
        lineStyle: { width: 1.5, type: 'dashed', color: colour },
        itemStyle: { color: colour },
        tooltip: { show: true },
      },
      // Same name as the curve: one legend entry shows or hides a material's curve and its points together.
      ...(points.length
        ? [
            {
              id: `measured-${m.id}`,
              name: m.name,
              type: 'scatter',
              data: points.map((p) => onAxes(axis, p)),
              symbol: 'circle',
              symbolSize: 7,
              itemStyle: { color: colour, borderColor: theme.surface, borderWidth: 1 },
              z: 3,
            },
          ]
        : []),
    ];
  });
  if (design) {
    const x = axis === 'frequency' ? design.frequency : design.deltaB;
    // A function, not a string: echarts reads "{…}" in a string formatter as a template.
    const label = designLabel(design, method);
    series.push({
      id: 'design-point',
      name: design.label,
      type: 'scatter',
      data: [onAxes(axis, [x, design[method]])],
      symbol: 'diamond',
      symbolSize: 16,
      itemStyle: { color: text, borderColor: theme.surface, borderWidth: 1.5 },
      label: { show: true, position: 'top', color: text, formatter: () => label },
      z: 4,
    });
  }
  const legendEntries = materials.length + (design ? 1 : 0);
  return themed(
    {
      animation: false,
      legend: { top: 0, type: 'plain' },
      tooltip: {
        trigger: 'axis',
        valueFormatter: (v: unknown) => (typeof v === 'number' ? `${trimmedNumber(v, 3)} ${LOSS_AXIS.unit}` : String(v)),
      },
      // Two legend entries fit on a line of a half-width chart; leave room for every line. Left and bottom leave room
      // for the tick labels and the axis names beyond them (nameGap).
      grid: { left: 92, right: 28, top: 32 + 24 * Math.ceil(legendEntries / 2), bottom: 64 },
      xAxis: {
        type: 'log',
        name: sweep.name,
        nameLocation: 'middle',
        nameGap: 36,
        splitLine: { show: true },
      },
      yAxis: {
        type: 'log',
        name: `Core-loss density (${LOSS_AXIS.unit})`,
        nameLocation: 'middle',
        nameGap: 64,
        splitLine: { show: true },
      },
      series,
    },
    theme,
  );
}
