import { describe, expect, it } from 'vitest';

import { accuracyChartOptions } from './accuracy-chart';
import type { PredictionSample } from '@shared/schemas/shop';

const sample: PredictionSample = {
  orderNumber: '<b>O-1</b>',
  designNumber: '<img src=x onerror="window.__injected=1">',
  revision: 2,
  material: '<meta http-equiv="refresh" content="0;url=/x">',
  core: 'R 25',
  predictedInductance: 1e-4,
  measuredInductance: 1.02e-4,
  predictedResistance20: 0.01,
  measuredResistance20: 0.011,
  passed: true,
  inductanceRatio: 1.02,
  resistanceRatio: 1.1,
};

describe('accuracy chart', () => {
  it('shows the order and design names with markup as text in the tooltip', () => {
    const options = accuracyChartOptions([sample]) as {
      series: { data: { name: string; value: [number, number] }[] }[];
      tooltip: { formatter: (p: { name: string; value: [number, number] }) => string };
    };
    const host = document.createElement('div');
    host.innerHTML = options.tooltip.formatter(options.series[0].data[0]);
    expect(host.querySelectorAll('img, b').length).toBe(0);
    expect(host.textContent).toBe('<b>O-1</b> · <img src=x onerror="window.__injected=1"> rev 2L ratio 1.020DCR ratio 1.100');
  });

  it('draws failed units apart from passing ones: triangles in a warning colour, passing units as circles', () => {
    const options = accuracyChartOptions([sample, { ...sample, passed: false, inductanceRatio: 0.7 }]) as {
      series: { name: string; symbol: string; itemStyle: { color: string }; data: { value: [number, number] }[] }[];
    };
    const [passed, failed] = options.series;
    expect(passed).toMatchObject({ name: 'Passed', symbol: 'circle' });
    expect(passed.data.map((d) => d.value[0])).toEqual([1.02]);
    expect(failed).toMatchObject({ name: 'Failed (not a good unit)', symbol: 'triangle' });
    expect(failed.data.map((d) => d.value[0])).toEqual([0.7]);
    expect(failed.itemStyle.color).not.toBe(passed.itemStyle.color);
  });
});
