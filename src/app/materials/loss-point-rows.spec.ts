import { describe, expect, it } from 'vitest';

import { cellsFromPastedText, cellsOfPoint, lossPointFileOf } from './loss-point-rows';

describe('loss-point rows', () => {
  it('reads tab-separated rows copied from a spreadsheet in the CSV column order', () => {
    const rows = cellsFromPastedText('100\t50\t25\t12.5\n\n200\t100\t90\t80\t40\tbench B\n');
    expect(rows).toHaveLength(2);
    expect(rows[0]).toEqual({
      frequency_khz: '100',
      peak_flux_mt: '50',
      temperature_c: '25',
      loss_kw_per_m3: '12.5',
      dc_bias_a_per_m: '',
      source: '',
    });
    expect(rows[1]).toMatchObject({ dc_bias_a_per_m: '40', source: 'bench B' });
  });

  it('lets a header line decide the order and ignores columns it does not know', () => {
    const rows = cellsFromPastedText('temperature_c;frequency_khz;note;peak_flux_mt;loss_kw_per_m3\n60;50;x;200;190\n');
    expect(rows).toEqual([
      { frequency_khz: '50', peak_flux_mt: '200', temperature_c: '60', loss_kw_per_m3: '190', dc_bias_a_per_m: '', source: '' },
    ]);
  });

  it('keeps text that is not a number, for the server to refuse by row and column', () => {
    expect(cellsFromPastedText('1e2,fifty,25,3')[0]).toMatchObject({ frequency_khz: '1e2', peak_flux_mt: 'fifty' });
  });

  it('turns a stored point (SI) into cells in kHz, mT, kW/m³ without float noise', () => {
    expect(cellsOfPoint({ frequency: 100e3, peakFlux: 0.07, temperature: 25, lossDensity: 12_300, source: 'a, "b"' })).toEqual({
      frequency_khz: '100',
      peak_flux_mt: '70',
      temperature_c: '25',
      loss_kw_per_m3: '12.3',
      dc_bias_a_per_m: '',
      source: 'a, "b"',
    });
  });

  it('writes the rows as a loss-point CSV with a header and quoted text', async () => {
    const file = lossPointFileOf([
      cellsOfPoint({ frequency: 100e3, peakFlux: 0.05, temperature: 25, lossDensity: 20e3, source: 'a, "b"' }),
    ]);
    expect(await file.text()).toBe(
      'frequency_khz,peak_flux_mt,temperature_c,loss_kw_per_m3,dc_bias_a_per_m,source\n100,50,25,20,,"a, ""b"""\n',
    );
  });
});
