import type { LossAtFrequency } from '@shared/engine/evaluate';
import { axisIn } from '@shared/units/index';
import type { EChartsCoreOption } from 'echarts/core';

import { themed, type ChartTheme } from '../charts/chart-theme';
import { splitByFlag } from '../charts/split-series';

export const INFEASIBLE_LEGEND = 'Not feasible here (saturates or overheats)';

/**
 * Loss of one built part against switching frequency, in kHz on a log axis. Where the part is not feasible (it
 * saturates or runs too hot) the curves turn dashed and the total carries a hollow red ring, named in the legend.
 */
export function frequencyChartOptions(
  sweep: readonly LossAtFrequency[],
  theme: ChartTheme,
  switchingFrequency?: number,
): EChartsCoreOption {
  if (!sweep.length) return {};
  // Total in the text colour, the strongest; copper in the copper primary; core in tertiary.
  const [totalColour, copperColour, coreColour] = [theme.text, theme.series[0], theme.series[1]];
  const x = axisIn('kHz');
  const curve = (name: string, colour: string, pick: (p: LossAtFrequency) => number) => {
    const { plain, flagged } = splitByFlag(sweep.map((p) => ({ x: x.toAxis(p.frequency), y: pick(p), flagged: !p.feasible })));
    const style = { color: colour };
    return [
      { type: 'line', name, data: plain, connectNulls: false, itemStyle: style, lineStyle: style },
      {
        type: 'line',
        name,
        data: flagged,
        connectNulls: false,
        showSymbol: false,
        itemStyle: style,
        lineStyle: { ...style, type: 'dashed' },
      },
    ];
  };
  const [total, totalDashed] = curve('Total', totalColour!, (p) => p.total);
  const infeasible = sweep.filter((p) => !p.feasible);
  const series: object[] = [
    {
      ...total,
      markLine: switchingFrequency
        ? { symbol: 'none', data: [{ xAxis: x.toAxis(switchingFrequency) }], label: { formatter: 'fs' } }
        : undefined,
    },
    totalDashed!,
    // Copper: DC, the ripple's Dowell loss and the gap's fringing-field loss in the winding.
    ...curve('Copper', copperColour!, (p) => p.copperDc + p.copperAc + p.copperGap),
    ...curve('Core', coreColour!, (p) => p.core),
  ];
  if (infeasible.length) {
    series.push({
      type: 'scatter',
      name: INFEASIBLE_LEGEND,
      symbol: 'emptyCircle',
      symbolSize: 12,
      itemStyle: { color: theme.error, borderWidth: 2 },
      data: infeasible.map((p) => [x.toAxis(p.frequency), p.total]),
    });
  }
  return themed(
    {
      animation: false,
      grid: { left: 56, right: 16, top: infeasible.length ? 56 : 32, bottom: 40 },
      legend: { top: 0 },
      tooltip: { trigger: 'axis' },
      xAxis: {
        type: 'log',
        name: x.unit,
        nameLocation: 'middle',
        nameGap: 24,
        min: x.toAxis(sweep[0]!.frequency),
        max: x.toAxis(sweep.at(-1)!.frequency),
        axisLabel: { formatter: (v: number) => String(Math.round(v)) },
      },
      yAxis: { type: 'value', name: 'W' },
      series,
    },
    theme,
  );
}

/** The chart's accessible description, naming the frequencies where the part is not feasible. */
export function frequencyChartLabel(sweep: readonly LossAtFrequency[]): string {
  const base = 'Total, copper and core loss of this build from a quarter to four times the switching frequency';
  const bad = sweep.filter((p) => !p.feasible).map((p) => `${Math.round(axisIn('kHz').toAxis(p.frequency))} kHz`);
  return bad.length ? `${base}; not feasible at ${bad.join(', ')}` : base;
}
