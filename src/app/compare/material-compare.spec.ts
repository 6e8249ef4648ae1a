import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, describe, expect, it } from 'vitest';

import { fieldLabelled, typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';
import { MaterialCompare } from './material-compare';

// Whole listed materials: the answer is parsed with the declared answer schema (invented figures).
const LISTED = {
  family: 'ferrite',
  version: 1,
  k: 1,
  alpha: 1.5,
  beta: 2.5,
  fitFrequencyMin: 1e4,
  fitFrequencyMax: 1e6,
  fitFluxMin: 0.01,
  fitFluxMax: 0.3,
  bsat25: 0.5,
  bsat100: 0.4,
  permeability: 2000,
  density: 4800,
  lineage: 'sample',
  retired: false,
  unitSet: 'W/m3-Hz-T',
  kUploaded: 1,
  referenceTemperature: null,
  provenance: 'invented',
  createdAt: '2026-01-01T00:00:00.000Z',
};
const MATERIALS = [
  { ...LISTED, id: '1', name: 'Sample ferrite A' },
  { ...LISTED, id: '2', name: 'Sample ferrite B' },
];

describe('MaterialCompare', () => {
  let fixture: ComponentFixture<MaterialCompare>;
  let http: HttpTestingController;
  let page: HTMLElement;

  afterEach(() => http.verify());

  it('draws the curves at ΔB and frequency typed with units, sent in SI', async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialCompare, {}, { settle: false }));
    http.expectOne('/api/materials').flush({ materials: MATERIALS });
    http.expectOne((r) => r.url === '/api/designs').flush({ items: [], total: 0, page: 0, pageSize: 100 });
    http.expectOne('/api/catalogue/cores').flush({ cores: [] });
    await fixture.whenStable();
    // The first drawing uses the defaults, shown with their units.
    expect(http.expectOne('/api/compare/curves').request.body).toEqual({
      materialIds: ['1', '2'],
      deltaB: 0.2,
      frequency: 100e3,
      duty: 0.5,
    });
    expect(fieldLabelled(page, 'ΔB for the frequency sweep, peak to peak').value).toBe('200 mT');
    expect(fieldLabelled(page, 'Frequency for the ΔB sweep').value).toBe('100 kHz');

    typeInto(page, 'ΔB for the frequency sweep, peak to peak', '50 mT', { leave: true });
    typeInto(page, 'Frequency for the ΔB sweep', '1 MHz', { leave: true });
    await fixture.whenStable();
    [...page.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Draw curves'))!.click();
    // milli 10⁻³, mega 10⁶ (BIPM SI Brochure, 9th ed., Table 7 — from memory).
    const request = http.expectOne('/api/compare/curves');
    expect(request.request.body.deltaB).toBeCloseTo(0.05, 15);
    expect(request.request.body.frequency).toBe(1e6);
  });

  it('refuses a frequency outside the curves’ range under the field and sends nothing', async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialCompare, {}, { settle: false }));
    http.expectOne('/api/materials').flush({ materials: MATERIALS });
    http.expectOne((r) => r.url === '/api/designs').flush({ items: [], total: 0, page: 0, pageSize: 100 });
    http.expectOne('/api/catalogue/cores').flush({ cores: [] });
    await fixture.whenStable();
    http.expectOne('/api/compare/curves');

    typeInto(page, 'Frequency for the ΔB sweep', '100', { leave: true });
    await fixture.whenStable();
    [...page.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Draw curves'))!.click();
    await fixture.whenStable();
    http.expectNone('/api/compare/curves');
    expect([...page.querySelectorAll('mat-error')].map((e) => e.textContent?.trim())).toEqual(['At least 1 kHz']);
  });
});
