import type { MaterialCurves } from '@shared/schemas/compare';
import { describe, expect, it } from 'vitest';

import { lossChartOptions, splitByFit, type LossChartInput } from './loss-chart-options';
import { FALLBACK_COLOURS, chartTheme } from '../charts/chart-theme';

const LIGHT = chartTheme(FALLBACK_COLOURS.light, 'light');

const point = (x: number, extrapolated: boolean) => ({ x, steinmetz: x * 2, igse: x * 3, extrapolated });

describe('splitByFit', () => {
  it('draws the fitted part solid and joins the dashed parts at the edges of the fit', () => {
    const { fitted, extrapolated } = splitByFit([point(1, true), point(2, false), point(3, false), point(4, true)], 'igse');
    expect(fitted).toEqual([null, [2, 6], [3, 9], null]);
    expect(extrapolated).toEqual([
      [1, 3],
      [2, 6],
      [3, 9],
      [4, 12],
    ]);
  });

  it('leaves the dashed line empty when every point lies in the fit', () => {
    const { fitted, extrapolated } = splitByFit([point(1, false), point(2, false), point(3, false)], 'steinmetz');
    expect(fitted).toEqual([
      [1, 2],
      [2, 4],
      [3, 6],
    ]);
    expect(extrapolated).toEqual([null, null, null]);
  });
});

// Two invented materials on a five-point sweep; loss = x W/m³ so the unit conversion is easy to follow.
const curve = (xs: number[]) => xs.map((x) => ({ x, steinmetz: x, igse: 2 * x, extrapolated: false }));
const MATERIALS: MaterialCurves[] = ['1', '2'].map((id) => ({
  id,
  name: `Sample ${id}`,
  family: 'ferrite',
  version: 1,
  fit: { frequencyMin: 50e3, frequencyMax: 300e3, fluxMin: 0.02, fluxMax: 0.25 },
  versusFrequency: curve([1e4, 1e5, 1e6]),
  versusFlux: curve([0.01, 0.1, 0.6]),
}));
const SLICE = { temperature: 100, deltaB: 0.2, frequency: 100e3 };
const at = (frequency: number, peakFlux: number, temperature: number, lossDensity = 5e4) => ({
  frequency,
  peakFlux,
  temperature,
  lossDensity,
});
interface Series {
  id?: string;
  type: string;
  name: string;
  data: ([number, number] | null)[];
  markArea?: { itemStyle: Record<string, unknown>; data: { xAxis: number }[][] };
  label?: { formatter: () => string };
}
interface Axis {
  name: string;
  nameGap: number;
}
function options(input: Partial<LossChartInput> = {}) {
  const o = lossChartOptions({ materials: MATERIALS, axis: 'frequency', method: 'igse', theme: LIGHT, ...input }) as {
    series: Series[];
    xAxis: Axis;
    yAxis: Axis;
    grid: { left: number; bottom: number };
  };
  return o;
}

describe('lossChartOptions', () => {
  it('draws in the fields’ units: kHz or ΔB in mT across, kW/m³ up, with room for the axis names', () => {
    const byFrequency = options();
    expect(byFrequency.xAxis.name).toBe('Frequency (kHz)');
    expect(byFrequency.yAxis.name).toBe('Core-loss density (kW/m³)');
    // 100 kHz; iGSE 2·1e5 W/m³ = 200 kW/m³ (kilo = 10³, from memory).
    expect(byFrequency.series[0]!.data[1]).toEqual([100, 200]);
    expect(options({ axis: 'flux' }).xAxis.name).toBe('Peak-to-peak flux swing ΔB (mT)');
    // ΔB 0.1 T = 100 mT; iGSE 2·0.1 W/m³ = 0.0002 kW/m³.
    expect(options({ axis: 'flux' }).series[0]!.data[1]).toEqual([100, 0.0002]);
    // The names sit beyond the tick labels (nameGap) and inside the grid's margin.
    expect(byFrequency.grid.left).toBeGreaterThan(byFrequency.yAxis.nameGap + 16);
    expect(byFrequency.grid.bottom).toBeGreaterThan(byFrequency.xAxis.nameGap + 16);
  });

  it('outlines each fitted range with a dashed box and no fill, in the axis unit', () => {
    for (const axis of ['frequency', 'flux'] as const) {
      const areas = options({ axis })
        .series.filter((s) => s.markArea)
        .map((s) => s.markArea!);
      expect(areas).toHaveLength(2);
      for (const area of areas) expect(area.itemStyle).toMatchObject({ color: 'transparent', borderType: 'dashed', borderWidth: 1 });
      // 50–300 kHz; peak 20–250 mT is ΔB 40–500 mT.
      expect(areas[0]!.data[0]!.map((edge) => edge.xAxis)).toEqual(axis === 'frequency' ? [50, 300] : [40, 500]);
    }
  });

  it('marks the measured points at the chart’s slice only, as scatter series of their material', () => {
    const measured = new Map([
      ['1', [at(100e3, 0.1, 100), at(200e3, 0.1019, 104), at(100e3, 0.103, 100), at(100e3, 0.1, 106), at(300e3, 0.05, 98)]],
      ['2', []],
    ]);
    const byFrequency = options({ measured, slice: SLICE }).series.filter((s) => s.type === 'scatter');
    // B̂ = 0.1 T ± 2 %, T = 100 ± 5 °C: the first two; 3 % off in flux and 6 °C off are left out.
    expect(byFrequency.map((s) => s.id)).toEqual(['measured-1']);
    expect(byFrequency[0]!.name).toBe('Sample 1');
    expect(byFrequency[0]!.data).toEqual([
      [100, 50],
      [200, 50],
    ]);
    // Against ΔB at 100 kHz ± 2 %: the points at 100 kHz and ±5 °C, drawn at ΔB = 2·B̂ (200 and 206 mT).
    const byFlux = options({ axis: 'flux', measured, slice: SLICE }).series.filter((s) => s.type === 'scatter');
    expect(byFlux[0]!.data).toEqual([
      [200, 50],
      [206, 50],
    ]);
    expect(options({ measured }).series.some((s) => s.type === 'scatter')).toBe(false);
  });

  it('marks a design’s operating point with its own loss and a label', () => {
    const design = { label: 'GW-0005 r1', frequency: 250e3, deltaB: 0.12, igse: 8e4, steinmetz: 7e4, temperature: 80.4, materialName: 'M' };
    const byFrequency = options({ design }).series.find((s) => s.id === 'design-point')!;
    expect(byFrequency.data).toEqual([[250, 80]]);
    expect(byFrequency.label!.formatter()).toBe('GW-0005 r1: 250 kHz, B̂ 60 mT, 80 kW/m³ at 80.4 °C');
    expect(options({ design, axis: 'flux', method: 'steinmetz' }).series.find((s) => s.id === 'design-point')!.data).toEqual([[120, 70]]);
    expect(options().series.some((s) => s.id === 'design-point')).toBe(false);
  });
});
