import { describe, expect, it } from 'vitest';

import type { CandidateRow } from './candidate-rows';
import { candidateTooltip, candidatesChartOptions } from './candidates-chart';

const MARKUP_CORE = '<img src=x onerror="window.__injected=1">';
const MARKUP_MATERIAL = '<meta http-equiv="refresh" content="0;url=/x">';

const row = (key: string, pareto: boolean): CandidateRow => ({
  key,
  rank: 1,
  feasible: true,
  pareto,
  coreId: MARKUP_CORE,
  family: 'other',
  materialId: '7',
  materialName: MARKUP_MATERIAL,
  wireId: '<b>bold</b>',
  turns: 20,
  totalLoss: 1.25,
  volume: 2e-6,
  rise: 30,
  fill: 0.3,
  fluxMargin: 0.2,
  reasons: '',
  candidate: null,
});

describe('candidates chart', () => {
  it('shows core, material and wire names with markup as text in the tooltip', () => {
    const options = candidatesChartOptions([row('a', true), row('b', false)], 'a') as {
      series: { data: { name: string; value: number[] }[] }[];
      tooltip: { formatter: typeof candidateTooltip };
    };
    const point = options.series[0].data[0];
    const host = document.createElement('div');
    host.innerHTML = options.tooltip.formatter(point);
    expect(host.querySelectorAll('img, meta, b').length).toBe(0);
    expect(host.textContent).toBe(`${MARKUP_CORE} · ${MARKUP_MATERIAL} · <b>bold</b>1.250 W, 2.00 cm³`);
  });

  it('draws nothing without a feasible candidate', () => {
    expect(candidatesChartOptions([{ ...row('a', false), feasible: false }], null)).toEqual({});
  });
});
