import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { designDetail } from '../testing/designs';
import { fieldLabelled, typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';
import { ENGINE_RESULT } from '../testing/search-answer';
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
  temperatureBehaviour: null,
  rollOffCurve: null,
  provenance: 'invented',
  createdAt: '2026-01-01T00:00:00.000Z',
};
const MATERIALS = [
  { ...LISTED, id: '1', name: 'Sample ferrite A' },
  { ...LISTED, id: '2', name: 'Sample ferrite B' },
  { ...LISTED, id: '3', name: 'Sample powder C', family: 'powder' },
];
const DESIGNS = { items: [], total: 0, page: 0, pageSize: 100 };
const MY_DESIGN = {
  id: 5,
  number: 'GW-0005',
  title: 'Sample rail',
  owner: { id: 7, displayName: 'Erin Example' },
  status: 'draft',
  revision: 1,
  summary: '',
  updatedAt: '2026-03-01T10:00:00.000Z',
};
/** A drawn curve (invented figures): loss = x W/m³. */
const curve = (xs: number[]) => xs.map((x) => ({ x, steinmetz: x, igse: x, extrapolated: false }));
const drawn = (id: string) => ({
  id,
  name: MATERIALS.find((m) => m.id === id)!.name,
  family: 'ferrite',
  version: 1,
  fit: { frequencyMin: 1e4, frequencyMax: 1e6, fluxMin: 0.01, fluxMax: 0.3 },
  versusFrequency: curve([1e4, 1e5, 1e6]),
  versusFlux: curve([0.01, 0.1, 1]),
});
const point = (frequency: number, peakFlux: number, temperature: number) => ({ frequency, peakFlux, temperature, lossDensity: 5e4 });

describe('MaterialCompare', () => {
  let fixture: ComponentFixture<MaterialCompare>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(() => {
    // The charts never load here; their options are read from the directive.
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
  });
  afterEach(() => http.verify());

  /** The page's first requests answered: the listed materials, the designs (all, and the user's own), the cores. */
  async function start(myDesigns: unknown[] = []): Promise<void> {
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialCompare, {}, { settle: false }));
    http.expectOne('/api/materials').flush({ materials: MATERIALS });
    http.expectOne((r) => r.url === '/api/designs' && r.params.get('scope') === 'all').flush(DESIGNS);
    http.expectOne((r) => r.url === '/api/designs' && r.params.get('scope') === 'mine').flush({ ...DESIGNS, items: myDesigns });
    http.expectOne('/api/catalogue/cores').flush({ cores: [] });
    await fixture.whenStable();
  }
  const charts = () =>
    fixture.debugElement
      .queryAll(By.directive(NgxEchartsDirective))
      .map((d) => d.injector.get(NgxEchartsDirective).options() as { series: { id?: string; type: string; data: unknown[] }[] });
  /** Opens the select of the field labelled `label`. */
  async function open(label: string): Promise<void> {
    const field = [...page.querySelectorAll('mat-form-field')].find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
    field.querySelector<HTMLElement>('.mat-mdc-select-trigger')!.click();
    await fixture.whenStable();
  }
  async function choose(label: string, option: string): Promise<void> {
    await open(label);
    [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => o.textContent?.trim() === option)!.click();
    await fixture.whenStable();
  }

  it('draws the curves at ΔB and frequency typed with units, sent in SI', async () => {
    await start();
    // The first drawing uses the defaults, shown with their units: every ferrite (the first family), at 100 °C.
    expect(http.expectOne('/api/compare/curves').request.body).toEqual({
      materialIds: ['1', '2'],
      deltaB: 0.2,
      frequency: 100e3,
      duty: 0.5,
      temperature: 100,
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
    await start();
    http.expectOne('/api/compare/curves');

    typeInto(page, 'Frequency for the ΔB sweep', '100', { leave: true });
    await fixture.whenStable();
    [...page.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Draw curves'))!.click();
    await fixture.whenStable();
    http.expectNone('/api/compare/curves');
    expect([...page.querySelectorAll('mat-error')].map((e) => e.textContent?.trim())).toEqual(['At least 1 kHz']);
  });

  it('offers every current material, draws the measured points of the drawn versions and a chosen design’s operating point', async () => {
    await start([MY_DESIGN]);
    await open('Materials');
    expect([...document.querySelectorAll('mat-option')].map((o) => o.textContent?.trim())).toEqual(
      expect.arrayContaining(['Sample ferrite A (v1)', 'Sample ferrite B (v1)', 'Sample powder C (v1)']),
    );
    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape' }));

    http
      .expectOne('/api/compare/curves')
      .flush({ deltaB: 0.2, frequency: 100e3, duty: 0.5, temperature: 100, materials: [drawn('1'), drawn('2')] });
    await fixture.whenStable();
    // At 100 °C and B̂ = 0.1 T: the first point only (the second is 10 °C away, the third at another flux).
    const points = [point(100e3, 0.1, 100), point(100e3, 0.1, 110), point(200e3, 0.05, 100)];
    http
      .expectOne('/api/materials/1/loss-points')
      .flush({ materialId: 1, name: 'Sample ferrite A', version: 1, current: true, canEdit: false, points });
    http
      .expectOne('/api/materials/2/loss-points')
      .flush({ materialId: 2, name: 'Sample ferrite B', version: 1, current: true, canEdit: false, points: [] });
    await fixture.whenStable();
    const [byFrequency] = charts();
    expect(byFrequency!.series.filter((s) => s.type === 'scatter').map((s) => s.id)).toEqual(['measured-1']);
    expect(page.querySelector('figcaption')?.textContent).toContain('1 measured point at B̂ = 100 mT');

    await choose('Design to mark', 'GW-0005 · Sample rail');
    const detail = designDetail();
    const wire = {
      id: 'foil 0.15 mm',
      kind: 'foil' as const,
      strandDiameter: 0.00015,
      strands: 1,
      overallDiameter: 0.0002,
      conductorsPerTurn: 1,
    };
    http.expectOne('/api/designs/5').flush({ ...detail, latest: { ...detail.latest, result: { wire, evaluation: ENGINE_RESULT } } });
    await fixture.whenStable();
    // The stored result: 100 kHz, iGSE 3983 W/m³ = 3.983 kW/m³ (src/app/testing/search-answer.ts).
    const mark = charts()[0]!.series.find((s) => s.id === 'design-point')!;
    expect(mark.data).toEqual([[100, 3.983]]);
    expect(page.textContent).toContain('Diamond: GW-0005 r1');
    // Drawing again fetches no points already held: a version's points never change.
    [...page.querySelectorAll<HTMLButtonElement>('button[type="submit"]')].find((b) => b.textContent?.includes('Draw curves'))!.click();
    http
      .expectOne('/api/compare/curves')
      .flush({ deltaB: 0.2, frequency: 100e3, duty: 0.5, temperature: 100, materials: [drawn('1'), drawn('2')] });
    await fixture.whenStable();
    http.expectNone((r) => r.url.includes('loss-points'));
  });

  it('says so when the chosen design has no saved result', async () => {
    await start([MY_DESIGN]);
    http.expectOne('/api/compare/curves');
    await choose('Design to mark', 'GW-0005 · Sample rail');
    http.expectOne('/api/designs/5').flush(designDetail());
    await fixture.whenStable();
    expect(page.querySelector('[role="status"]')?.textContent).toContain('GW-0005 has no saved result yet');
  });
});
