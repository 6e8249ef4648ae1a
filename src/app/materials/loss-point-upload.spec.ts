import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { LossPointUpload } from './loss-point-upload';

const SUMMARY = {
  rows: 2,
  valid: 1,
  errors: 1,
  frequencies: 1,
  fluxes: 1,
  temperatures: 1,
  frequencyRange: [1e5, 1e5],
  fluxRange: [0.1, 0.1],
  temperatureRange: [25, 25],
};

describe('LossPointUpload', () => {
  let fixture: ComponentFixture<LossPointUpload>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(LossPointUpload, { materialId: '7' }));
  });

  afterEach(() => http.verify());

  async function chooseFile(): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(input, 'files', { value: [new File(['x'], 'bench.csv', { type: 'text/csv' })], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;

  it('lists the problems by row and column and across rows, and writes nothing', async () => {
    await chooseFile();
    http.expectOne('/api/materials/7/loss-points/preview').flush({
      fileName: 'bench.csv',
      rows: [
        { row: 2, status: 'ok', problems: [] },
        { row: 3, status: 'error', problems: [{ column: 'loss_kw_per_m3', message: 'must be above 0 (got -1)' }] },
      ],
      fileProblems: [{ column: 'frequency_khz', message: 'all points are at one frequency' }],
      summary: SUMMARY,
    });
    await fixture.whenStable();

    expect(page.querySelector('.gw-row-problems tbody')?.textContent).toContain('3loss_kw_per_m3: must be above 0 (got -1)');
    expect(page.querySelector('.gw-file-problems')?.textContent).toContain('frequency_khz: all points are at one frequency');
    expect(button('Save as a new version with these points').disabled).toBe(true);
  });

  it('commits a clean file as a new version', async () => {
    let committed: unknown = null;
    fixture.componentInstance.committed.subscribe((result) => (committed = result));
    await chooseFile();
    http.expectOne('/api/materials/7/loss-points/preview').flush({
      fileName: 'bench.csv',
      rows: [{ row: 2, status: 'ok', problems: [] }],
      fileProblems: [],
      summary: { ...SUMMARY, rows: 3, valid: 3, errors: 0, frequencies: 2 },
    });
    await fixture.whenStable();

    button('Save as a new version with these points').click();
    http
      .expectOne('/api/materials/7/loss-points/commit')
      .flush({ materialId: 8, version: 4, pointCount: 3 }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(committed).toEqual({ materialId: 8, version: 4, pointCount: 3 });
  });

  it('checks typed and pasted points as a file through the same preview, naming rows as a file would', async () => {
    fixture.componentRef.setInput('points', [{ frequency: 100e3, peakFlux: 0.05, temperature: 25, lossDensity: 20e3 }]);
    await fixture.whenStable();
    const cell = (label: string) => page.querySelector<HTMLInputElement>(`input[aria-label="${label}"]`)!;
    expect(cell('Frequency (kHz), row 2').value).toBe('100');

    const paste = page.querySelector<HTMLTextAreaElement>('textarea[aria-label="Pasted loss-point rows"]')!;
    paste.value = '200\t50\t25\t-1';
    paste.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    button('Add the pasted rows').click();
    await fixture.whenStable();
    expect(cell('Loss density (kW/m³), row 3').value).toBe('-1');
    expect(page.textContent).toContain('Added 1 pasted row.');

    button('Check these points').click();
    const preview = http.expectOne('/api/materials/7/loss-points/preview');
    const sent = (preview.request.body as FormData).get('file') as File;
    expect(await sent.text()).toBe(
      'frequency_khz,peak_flux_mt,temperature_c,loss_kw_per_m3,dc_bias_a_per_m,source\n100,50,25,20,,\n200,50,25,-1,,\n',
    );
    preview.flush({
      fileName: 'typed-points.csv',
      rows: [
        { row: 2, status: 'ok', problems: [] },
        { row: 3, status: 'error', problems: [{ column: 'loss_kw_per_m3', message: 'must be above 0 (got -1)' }] },
      ],
      fileProblems: [],
      summary: SUMMARY,
    });
    await fixture.whenStable();
    expect(page.textContent).toContain('Preview of the typed points');
    expect(page.querySelector('.gw-row-problems tbody')?.textContent).toContain('3loss_kw_per_m3: must be above 0 (got -1)');
  });
});
