import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import type { DesignSpec } from '@shared/schemas/designs';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import { afterEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { searchAnswer, searchCandidate } from '../testing/search-answer';
import { CandidatesPanel } from './candidates-panel';

const SPEC: DesignSpec = {
  converter: { vinMin: 36, vinMax: 60, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3, rectifier: 'ideal' },
  materialIds: ['2'],
};
const page = (offset: number, size = 20) => Array.from({ length: size }, (_, i) => searchCandidate({ rank: offset + i + 1 }));
const FIT_TEXT = '500 kHz is outside the 50–300 kHz range the Sample ferrite loss coefficients were fitted on.';
const FRINGING_TEXT = 'Gap 2.10 mm is 0.35·√Ae: the fringing formula is only trusted below 0.3·√Ae.';

describe('CandidatesPanel', () => {
  let fixture: ComponentFixture<CandidatesPanel>;
  let http: HttpTestingController;
  let host: HTMLElement;

  afterEach(() => http.verify());

  async function render(): Promise<void> {
    // The chart library is never loaded here (no canvas): the specs read the options the chart is given.
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    ({ fixture, http, page: host } = await renderWithHttpTesting(CandidatesPanel, { spec: SPEC, materials: [] }));
  }

  const button = (text: string) => {
    const found = [...host.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent?.trim() === text);
    if (!found) throw new Error(`No button "${text}"`);
    return found;
  };
  const searchRequest = () => http.expectOne((r) => r.method === 'POST' && r.url === '/api/calc/search');
  const status = () => host.querySelector('[data-testid="search-status"]')!.textContent!.trim();

  async function searchAndAnswer(answer = searchAnswer({ candidates: page(0) })) {
    button('Search candidates').click();
    const request = searchRequest();
    request.flush(answer);
    await fixture.whenStable();
    return request.request.body;
  }

  it('searches with the default objective, and ranks again from the first page when the objective changes', async () => {
    await render();
    const first = await searchAndAnswer();
    expect(first).toMatchObject({ spec: SPEC.converter, materialIds: ['2'], rankBy: 'smallest', offset: 0, limit: 20 });
    expect(host.querySelector('caption')!.textContent).toContain('Ranked smallest part first: candidates 1–20 of 388');

    button('Lowest loss').click();
    await fixture.whenStable();
    const loss = searchRequest();
    expect(loss.request.body).toMatchObject({ rankBy: 'loss', offset: 0, limit: 20, materialIds: ['2'] });
    loss.flush(searchAnswer({ rankBy: 'loss', candidates: page(0) }));
    await fixture.whenStable();
    expect(status()).toMatch(/^Candidates 1–20 of 388, lowest loss first\./);
    expect(host.querySelector('caption')!.textContent).toContain('Ranked lowest loss first');

    // The Rise column's header ranks the whole list on the server by temperature; its header says so.
    const rise = host.querySelector<HTMLButtonElement>('button[data-rank-by="temperature"]')!;
    rise.click();
    await fixture.whenStable();
    const temperature = searchRequest();
    expect(temperature.request.body).toMatchObject({ rankBy: 'temperature', offset: 0 });
    temperature.flush(searchAnswer({ rankBy: 'temperature', candidates: page(0) }));
    await fixture.whenStable();
    expect(host.querySelector('th[aria-sort="ascending"]')!.textContent).toContain('Rise');
    expect(status()).toMatch(/lowest temperature rise first/);
  });

  it('asks the server for each page and says which candidates are shown', async () => {
    await render();
    await searchAndAnswer(searchAnswer({ candidates: page(0), counts: { ...searchAnswer({ candidates: [] }).counts, extrapolated: 37 } }));
    expect(host.querySelectorAll('[data-testid="candidates-table"] tr.mat-mdc-row').length).toBe(20);

    host.querySelector<HTMLButtonElement>('button[aria-label="Next page"]')!.click();
    await fixture.whenStable();
    const next = searchRequest();
    expect(next.request.body).toMatchObject({ rankBy: 'smallest', offset: 20, limit: 20, materialIds: ['2'] });
    next.flush(
      searchAnswer({
        candidates: page(20),
        page: { offset: 20, limit: 20, total: 388 },
        counts: { ...searchAnswer({ candidates: [] }).counts, extrapolated: 37 },
      }),
    );
    await fixture.whenStable();
    expect(status()).toMatch(
      /^Candidates 21–40 of 388, smallest part first; 37 rest on extrapolated loss data and follow the in-fit ones\. 388 feasible of 5,210 evaluated \(79 cores × 5 materials\) in \d+ ms\.$/,
    );
    expect(host.querySelector('[data-testid="candidates-table"] tr.mat-mdc-row td')!.textContent).toContain('21');
    expect(host.querySelector('.mat-mdc-paginator-range-label')!.textContent).toContain('21 – 40 of 388');
  });

  it('shows warnings as marks with an accessible name and their full text on demand', async () => {
    await render();
    const warned = searchCandidate({
      rank: 1,
      extrapolated: true,
      warnings: [
        { code: 'loss-fit-frequency', message: FIT_TEXT },
        { code: 'fringing-range', message: FRINGING_TEXT },
      ],
    });
    await searchAndAnswer(searchAnswer({ candidates: [warned, ...page(1, 3)] }));

    const extrapolated = host.querySelector<HTMLButtonElement>('button.gw-mark[aria-label="Extrapolated loss data"]')!;
    const fringing = host.querySelector<HTMLButtonElement>('button.gw-mark[aria-label="Gap beyond the fringing formula"]')!;
    expect(extrapolated.textContent!.trim()).toBe('Extrap.');
    expect(fringing.textContent!.trim()).toBe('Fringing');
    // The full text is the mark's description (read by screen readers with the name) and its tooltip.
    const description = (mark: HTMLElement) => document.getElementById(mark.getAttribute('aria-describedby') ?? '')?.textContent;
    expect(description(extrapolated)).toContain(FIT_TEXT);
    expect(description(fringing)).toBe(FRINGING_TEXT);
    fringing.click();
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(document.querySelector('.mat-mdc-tooltip')?.textContent).toContain(FRINGING_TEXT);
    // Rows without warnings carry no marks.
    const rows = host.querySelectorAll('[data-testid="candidates-table"] tr.mat-mdc-row');
    expect(rows[1].querySelectorAll('.gw-mark').length).toBe(0);
  });

  it('draws the whole Pareto front by volume and by mass from the answer, not from the page', async () => {
    await render();
    const byVolume = [1, 7, 30].map((rank) => searchCandidate({ rank, pareto: true, coreId: `Front V${rank}` }));
    const byMass = [2, 40].map((rank) =>
      searchCandidate({ rank, paretoByMass: true, coreId: `Front M${rank}`, extrapolated: rank === 40 }),
    );
    await searchAndAnswer(searchAnswer({ candidates: page(0, 5), paretoFront: byVolume, paretoFrontByMass: byMass }));

    const options = () =>
      fixture.debugElement.query(By.directive(NgxEchartsDirective)).injector.get(NgxEchartsDirective).options() as {
        series: { name: string; data: { name: string; symbol?: string; itemStyle?: { borderWidth?: number } }[] }[];
      };
    const frontNames = () => options().series[0].data.map((p) => p.name.split(' · ')[0]);
    expect(frontNames()).toEqual(['Front V1', 'Front V7', 'Front V30']);
    expect(options().series[1].data.length).toBe(5);

    button('Mass (2 points)').click();
    await fixture.whenStable();
    expect(frontNames()).toEqual(['Front M2', 'Front M40']);
    expect(options().series[0].data.map((p) => p.symbol)).toEqual([undefined, 'diamond']);
    expect(options().series[0].data.map((p) => p.itemStyle?.borderWidth)).toEqual([undefined, 2]);
  });

  it('says in place of the chart that no candidate meets every limit when nothing is feasible', async () => {
    await render();
    await searchAndAnswer(searchAnswer({ candidates: [], page: { offset: 0, limit: 20, total: 0 } }));

    expect(fixture.debugElement.query(By.directive(NgxEchartsDirective))).toBeNull();
    expect(host.querySelector('[data-testid="candidates-chart-empty"]')!.textContent).toContain(
      'No candidate meets every limit, so there is nothing to plot',
    );

    await searchAndAnswer(searchAnswer({ candidates: page(0, 3) }));
    expect(fixture.debugElement.query(By.directive(NgxEchartsDirective))).not.toBeNull();
    expect(host.querySelector('[data-testid="candidates-chart-empty"]')).toBeNull();
  });

  it('shows the same part ground and on a spacer as two rows, and uses the one chosen', async () => {
    await render();
    const ground = searchCandidate({ rank: 1, coreId: 'P26/16' });
    const spacer = searchCandidate({ rank: 2, coreId: 'P26/16', placement: 'spacer' });
    await searchAndAnswer(searchAnswer({ candidates: [ground, spacer] }));
    const rows = [...host.querySelectorAll<HTMLElement>('[data-testid="candidates-table"] tr.mat-mdc-row')];
    expect(rows.length).toBe(2);
    const gapCell = (row: HTMLElement) => row.querySelector('td.mat-column-gap')!.textContent!.replace(/\s+/g, ' ').trim();
    // the template's ground gap 1.049 mm, and its spacer alternative 0.5243 mm under all legs
    expect(gapCell(rows[0])).toBe('1.05');
    expect(gapCell(rows[1])).toBe('2 × 0.524 spacer');
    const picked: unknown[] = [];
    fixture.componentInstance.picked.subscribe((c) => picked.push(c));
    rows[1].click();
    await fixture.whenStable();
    button('Use selected candidate').click();
    expect(picked).toEqual([spacer]);
  });
});
