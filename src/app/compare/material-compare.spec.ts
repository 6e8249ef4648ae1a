import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, describe, expect, it } from 'vitest';

import { fieldLabelled, typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';
import { MaterialCompare } from './material-compare';

const MATERIALS = [
  { id: '1', name: 'Sample ferrite A', family: 'ferrite', version: 1 },
  { id: '2', name: 'Sample ferrite B', family: 'ferrite', version: 1 },
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
    expect(http.expectOne('/api/compare/curves').request.body).toEqual({ materialIds: ['1', '2'], deltaB: 0.2, frequency: 100e3, duty: 0.5 });
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
