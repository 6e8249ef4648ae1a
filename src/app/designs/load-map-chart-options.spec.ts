import { describe, expect, it } from 'vitest';
import type { LoadPoint, LossMap } from '@shared/engine/load-map';

import { DCM_LEGEND, loadMapChartLabel, loadMapChartOptions } from './load-map-chart-options';
import { FALLBACK_COLOURS, chartTheme } from '../charts/chart-theme';

const LIGHT = chartTheme(FALLBACK_COLOURS.light, 'light');

const point = (corner: LoadPoint['corner'], loadFraction: number, mode: LoadPoint['mode']): LoadPoint => ({
  corner,
  vin: corner === 'min' ? 36 : corner === 'max' ? 60 : 48,
  loadFraction,
  iout: loadFraction * 10,
  mode,
  peakCurrent: 1,
  copperDc: 0.5,
  copperAc: 0.1,
  copperGap: 0,
  core: 0.4,
  total: 1,
  share: 1 / (12 * loadFraction * 10),
  rise: 20,
  runaway: false,
});

const map: LossMap = {
  inductance: 30e-6,
  inputs: { min: 36, nominal: 48, max: 60 },
  points: (['min', 'nominal', 'max'] as const).flatMap((c) => [point(c, 0.1, c === 'max' ? 'dcm' : 'ccm'), point(c, 1, 'ccm')]),
};

interface Series {
  name: string;
  data: [number, number][];
  yAxisIndex?: number;
  lineStyle?: { type?: string };
}

describe('loss map chart', () => {
  const options = loadMapChartOptions(map, LIGHT) as { series: Series[] };

  it('draws each input voltage as a solid loss line and a dashed share line on the right axis, in % load', () => {
    const loss = options.series.find((s) => s.name === 'Vin max loss')!;
    const share = options.series.find((s) => s.name === 'Vin max share')!;
    expect(loss.data).toEqual([
      [10, 1],
      [100, 1],
    ]);
    expect(share.yAxisIndex).toBe(1);
    expect(share.lineStyle?.type).toBe('dashed');
    expect(share.data[0]![1]).toBeCloseTo(100 / 12, 9);
  });

  it('rings the points in discontinuous conduction and names them in the label', () => {
    expect(options.series.find((s) => s.name === DCM_LEGEND)!.data).toEqual([[10, 1]]);
    expect(loadMapChartLabel(map)).toMatch(/load at three input voltages.*; discontinuous conduction up to 10 % load at Vin max$/);
  });

  it('says the map is missing rather than drawing nothing silently', () => {
    expect(loadMapChartOptions(undefined, LIGHT)).toEqual({});
    expect(loadMapChartLabel(undefined)).toBe('Loss map not computed');
  });
});
