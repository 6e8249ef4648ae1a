import { describe, expect, it } from 'vitest';
import type { LossAtFrequency } from '@shared/engine/evaluate';

import { INFEASIBLE_LEGEND, frequencyChartLabel, frequencyChartOptions } from './frequency-chart-options';
import { FALLBACK_COLOURS, chartTheme } from '../charts/chart-theme';

const LIGHT = chartTheme(FALLBACK_COLOURS.light, 'light');

const point = (frequency: number, feasible: boolean): LossAtFrequency => ({
  frequency,
  feasible,
  copperDc: 1,
  copperAc: 0.1,
  copperGap: 0.05,
  core: 0.15,
  total: 1.3,
  rise: 30,
});

interface Series {
  name: string;
  type: string;
  data: unknown[];
  lineStyle?: { type?: string };
  symbol?: string;
  itemStyle?: object;
}

describe('loss-versus-frequency chart', () => {
  const sweep = [point(25e3, false), point(50e3, true), point(100e3, true)];
  const options = frequencyChartOptions(sweep, LIGHT, 100e3) as { series: Series[] };

  it('draws the total solid where the part is feasible and dashed from the neighbouring point into the infeasible one', () => {
    const [solid, dashed] = options.series.filter((s) => s.name === 'Total');
    expect(solid!.data).toEqual([null, [50, 1.3], [100, 1.3]]);
    expect(dashed!.lineStyle?.type).toBe('dashed');
    expect(dashed!.data).toEqual([[25, 1.3], [50, 1.3], null]);
  });

  it("counts the gap's fringing-field loss as copper", () => {
    const [copper] = options.series.filter((s) => s.name === 'Copper');
    const [frequency, copperLoss] = copper!.data[2] as [number, number];
    expect(frequency).toBe(100);
    expect(copperLoss).toBeCloseTo(1 + 0.1 + 0.05, 12);
  });

  it('rings each infeasible point and names it in the legend and the description', () => {
    const marks = options.series.find((s) => s.name === INFEASIBLE_LEGEND);
    expect(marks?.symbol).toBe('circle');
    expect(marks?.itemStyle).toEqual({ color: LIGHT.surface, borderColor: LIGHT.error, borderWidth: 2 });
    expect(marks?.data).toEqual([[25, 1.3]]);
    expect(frequencyChartLabel(sweep)).toMatch(/; not feasible at 25 kHz$/);
  });

  it('adds no legend entry when the part is feasible everywhere', () => {
    const fine = frequencyChartOptions([point(50e3, true), point(100e3, true)], LIGHT) as { series: Series[] };
    expect(fine.series.some((s) => s.name === INFEASIBLE_LEGEND)).toBe(false);
    expect(frequencyChartLabel([point(50e3, true)])).not.toMatch(/not feasible/);
    expect(frequencyChartOptions([], LIGHT)).toEqual({});
  });
});
