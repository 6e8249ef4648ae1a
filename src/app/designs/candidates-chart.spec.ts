import { describe, expect, it } from 'vitest';

import { searchCandidate, type CandidateOptions } from '../testing/search-answer';
import { candidateRow } from './candidate-rows';
import { EXTRAPOLATED_LEGEND, candidatesChartOptions, roundNumber, type CandidatesChartInput } from './candidates-chart';
import { FALLBACK_COLOURS, chartTheme } from '../charts/chart-theme';

const LIGHT = chartTheme(FALLBACK_COLOURS.light, 'light');
interface Hollow {
  color?: string;
  borderColor?: string;
  borderWidth?: number;
}

const MARKUP_CORE = '<img src=x onerror="window.__injected=1">';
const MARKUP_MATERIAL = '<meta http-equiv="refresh" content="0;url=/x">';
const names = new Map([['7', MARKUP_MATERIAL]]);

interface Options {
  series: {
    name: string;
    symbol?: string;
    itemStyle?: Hollow;
    data: { name: string; value: number[]; symbol?: string; itemStyle?: Hollow; key: string }[];
  }[];
  tooltip: { formatter: (p: unknown) => string };
  xAxis: { name: string };
}

/** The options as the spec reads them (echarts types them loosely). */
const optionsOf = (input: CandidatesChartInput) => candidatesChartOptions(input, LIGHT) as unknown as Options;
const row = (rank: number, o: Omit<CandidateOptions, 'rank'> = {}) => candidateRow(searchCandidate({ rank, ...o }), names);

describe('candidates chart', () => {
  it('shows core, material and wire names with markup as text in the tooltip', () => {
    const marked = row(3, { coreId: MARKUP_CORE, materialId: '7', totalLoss: 1.25, volume: 2e-6, extrapolated: true });
    const options = optionsOf({ front: [marked], page: [], by: 'volume', selected: null });
    const point = options.series[0].data[0];
    const host = document.createElement('div');
    host.innerHTML = options.tooltip.formatter({ ...point, data: point });
    expect(host.querySelectorAll('img, meta, b').length).toBe(0);
    // 2e-6 m³ = 2 cm³ (1 cm³ = 10⁻⁶ m³, BIPM SI Brochure, 9th ed. — from memory).
    expect(host.textContent).toBe(
      `${MARKUP_CORE} · ${MARKUP_MATERIAL} · foil 0.15 mm1.250 W, 2.00 cm³Rank 3 · core loss from extrapolated data`,
    );
  });

  it('joins the whole front in order of size and draws the page apart, extrapolated points hollow', () => {
    const front = [row(9, { volume: 9e-6 }), row(1, { volume: 1e-6 }), row(4, { volume: 4e-6, extrapolated: true })];
    const page = [row(1, { volume: 1e-6 }), row(2, { volume: 2e-6 }), row(5, { volume: 5e-6, extrapolated: true })];
    const options = optionsOf({ front, page, by: 'volume', selected: page[1] });
    const [line, fit, extrapolated, selected] = options.series;
    expect(line.data.map((p) => p.value[0])).toEqual([1, 4, 9]);
    // Hollow: the shape filled with the page's surface colour, ringed in the series colour.
    expect(line.data.map((p) => p.symbol)).toEqual([undefined, 'diamond', undefined]);
    expect(line.data.map((p) => p.itemStyle?.color)).toEqual([undefined, LIGHT.surface, undefined]);
    expect(fit.data.map((p) => p.value[0])).toEqual([1, 2]);
    expect(extrapolated.name).toBe(EXTRAPOLATED_LEGEND);
    expect(extrapolated.symbol).toBe('circle');
    expect(extrapolated.itemStyle).toEqual({ color: LIGHT.surface, borderColor: LIGHT.series[2], borderWidth: 2 });
    expect(extrapolated.data.map((p) => p.value[0])).toEqual([5]);
    expect(selected.data.map((p) => p.key)).toEqual([page[1].key]);
    expect(options.xAxis.name).toBe('Core volume (cm³)');
  });

  it('plots the mass front in grams', () => {
    // 0.0261 kg = 26.1 g (1 g = 10⁻³ kg — from memory).
    const options = optionsOf({ front: [row(1, { mass: 0.0261 })], page: [], by: 'mass', selected: null });
    expect(options.series[0].data[0].value[0]).toBeCloseTo(26.1, 12);
    expect(options.xAxis.name).toBe('Mass, core and copper (g)');
  });

  it('ends the log size axis on round numbers of the 1-2-5 series around the data', () => {
    expect(roundNumber(3.4, 'down')).toBe(2);
    expect(roundNumber(100.5, 'up')).toBe(200);
    expect(roundNumber(0.34, 'down')).toBe(0.2);
    expect(roundNumber(0.5, 'up')).toBe(0.5);
    expect(roundNumber(12, 'down')).toBe(10);
    expect(roundNumber(60, 'up')).toBe(100);
  });

  it('draws nothing without a candidate', () => {
    expect(candidatesChartOptions({ front: [], page: [], by: 'volume', selected: null }, LIGHT)).toEqual({});
  });
});
