import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { EvaluateAnswer } from '@shared/schemas/calc-answers';
import type { Construction, DesignSpec } from '@shared/schemas/designs';
import { provideEchartsCore } from 'ngx-echarts';
import { describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { searchCandidate } from '../testing/search-answer';
import { DesignPanel } from './design-panel';

const SPEC: DesignSpec = {
  converter: { vinMin: 36, vinMax: 60, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3, rectifier: 'ideal' },
};
const spacer = searchCandidate({ rank: 1, coreId: 'P26/16', placement: 'spacer' });
const ground = searchCandidate({ rank: 1, coreId: 'P26/16' });
const answer = (c: typeof spacer): EvaluateAnswer => ({ engineVersion: '2.0.0', wire: c.wire, result: c.result, lossVersusFrequency: [] });
const CONSTRUCTION: Construction = {
  coreId: 'P26/16',
  materialId: '2',
  turns: 16,
  gap: spacer.result.gap.spacer,
  placement: 'spacer',
  wire: { kind: 'foil', strandDiameter: 0.00015, strands: 1 },
};

describe('DesignPanel gap placement', () => {
  let fixture: ComponentFixture<DesignPanel>;
  let http: HttpTestingController;
  let page: HTMLElement;

  const evaluation = async () => {
    await new Promise((resolve) => setTimeout(resolve, 350)); // the panel waits 300 ms for more edits
    return http.expectOne((r) => r.method === 'POST' && r.url === '/api/calc/evaluate');
  };
  const label = (text: string) => [...page.querySelectorAll('mat-label')].find((l) => l.textContent?.trim() === text);

  it('shows a spacer design as such and solves the gap again when the ground centre gap is chosen', async () => {
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    ({ fixture, http, page } = await renderWithHttpTesting(
      DesignPanel,
      { spec: SPEC, construction: CONSTRUCTION, known: answer(spacer) },
      { settle: false },
    ));
    for (const request of http.match((r) => r.url.endsWith('/cores'))) request.flush({ cores: [] });
    await fixture.whenStable();
    expect(page.querySelector('mat-select[data-field="placement"]')!.textContent).toContain('spacer under all legs');
    expect(label('Spacer thickness')).toBeDefined();
    expect(page.querySelector('[data-figure="gap"]')!.textContent).toMatch(/spacer .* under all legs \(two gaps/);

    const changes: Construction[] = [];
    fixture.componentInstance.changed.subscribe((c) => changes.push(c.construction));
    page.querySelector<HTMLElement>('mat-select[data-field="placement"] .mat-mdc-select-trigger')!.click();
    await fixture.whenStable();
    const option = [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => o.textContent?.trim() === 'ground centre gap')!;
    option.click();
    await fixture.whenStable();
    const second = await evaluation();
    // another placement keeps the turns; the ground gap is solved, not the spacer thickness reused
    expect(second.request.body).toMatchObject({ placement: 'ground', gap: 'auto', turns: 16 });
    second.flush(answer(ground));
    await fixture.whenStable();
    expect(changes.at(-1)).toMatchObject({ placement: 'ground', gap: ground.result.gap.total, turns: 16 });
    expect(label('Ground gap')).toBeDefined();
    expect(page.querySelector('[data-figure="gap"]')!.textContent).toMatch(/ground centre gap .* \(same L: spacer/);
  });

  it('says beside the core loss whether DC bias is included, in the words the engine gives', async () => {
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    const statement = 'DC bias is not included: Demo ferrite Teal (illustrative) has no DC-bias loss data';
    const withBias: EvaluateAnswer = {
      ...answer(spacer),
      result: { ...spacer.result, coreLoss: { ...spacer.result.coreLoss, dcBias: { field: 80, factor: 1, included: false, statement } } },
    };
    ({ fixture, http, page } = await renderWithHttpTesting(
      DesignPanel,
      { spec: SPEC, construction: CONSTRUCTION, known: withBias },
      { settle: false },
    ));
    for (const request of http.match((r) => r.url.endsWith('/cores'))) request.flush({ cores: [] });
    await fixture.whenStable();
    const core = page.querySelector('[data-figure="core-loss"] .gw-dc-bias')!;
    expect(core.textContent).toContain(statement);
    expect(core.classList).toContain('gw-note');
  });
});

describe('DesignPanel thermal figures', () => {
  const render = async (known: EvaluateAnswer) => {
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    const { fixture, http, page } = await renderWithHttpTesting(
      DesignPanel,
      { spec: SPEC, construction: CONSTRUCTION, known },
      { settle: false },
    );
    for (const request of http.match((r) => r.url.endsWith('/cores'))) request.flush({ cores: [] });
    await fixture.whenStable();
    return page;
  };
  const text = (page: HTMLElement, figure: string) =>
    page.querySelector(`[data-figure="${figure}"]`)?.textContent?.replace(/\s+/g, ' ').trim();

  it('shows both node temperatures and, for a pot core, only the surface law as a cross-check', async () => {
    const page = await render(answer(ground));
    expect(text(page, 'node-temperatures')).toBe('79.2 °C / 80.4 °C (rise 40.4 K)');
    expect(text(page, 'empirical-rises')).toBe('37.5 K');
    expect(page.textContent).toContain('Cross-check: rise by the surface law');
  });

  it('adds the core-volume law where it applies and reads a result saved before the network (no node temperatures)', async () => {
    const thermal = { ...ground.result.thermal, riseByVolume: 42.1, coreTemperature: undefined, windingTemperature: undefined };
    const page = await render(answer({ ...ground, result: { ...ground.result, thermal } }));
    expect(text(page, 'node-temperatures')).toBeUndefined();
    expect(page.textContent).toContain('Rise / hot spot');
    expect(text(page, 'empirical-rises')).toBe('37.5 K / 42.1 K');
    // No cross-check in the answer, no line for it.
    expect(page.querySelector('[data-figure="gap-loss-images"]')).toBeNull();
  });
});

describe('DesignPanel keep-out and gap-field loss', () => {
  it("shows the keep-out and the winding loss from the gap's field, and keeps the keep-out when the turns change", async () => {
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    const result = {
      ...ground.result,
      winding: { ...ground.result.winding, keepOut: 1.5e-3 },
      copper: { ...ground.result.copper, gapLoss: 0.042 },
    };
    const construction: Construction = { ...CONSTRUCTION, placement: 'ground', gap: ground.result.gap.total, keepOut: 1.5e-3 };
    const { fixture, http, page } = await renderWithHttpTesting(
      DesignPanel,
      { spec: SPEC, construction, known: { ...answer(ground), result, gapLossByWindowImages: 0.031 } },
      { settle: false },
    );
    for (const request of http.match((r) => r.url.endsWith('/cores'))) request.flush({ cores: [] });
    await fixture.whenStable();
    expect(page.querySelector('[data-figure="keep-out"]')!.textContent).toMatch(/copper ≥ 1\.5 mm from the centre leg/);
    const gapLoss = page.querySelector('[data-figure="gap-loss"]')!;
    expect(gapLoss.previousElementSibling!.textContent).toBe("Winding loss from the gap's field");
    expect(gapLoss.textContent).toMatch(/42(\.0)? mW/);
    expect(page.querySelector('[aria-label^="Losses:"]')!.getAttribute('aria-label')).toContain("winding loss from the gap's field 42");
    const imageCheck = page.querySelector('[data-figure="gap-loss-images"]')!;
    expect(imageCheck.previousElementSibling!.textContent).toBe("Cross-check: the same by the window's images");
    expect(imageCheck.textContent).toMatch(/^\s*31(\.0)? mW/);

    const turns = page.querySelector<HTMLInputElement>('input[formcontrolname="turns"]')!;
    turns.value = '17';
    turns.dispatchEvent(new Event('input'));
    await new Promise((resolve) => setTimeout(resolve, 350));
    const request = http.expectOne((r) => r.method === 'POST' && r.url === '/api/calc/evaluate');
    expect(request.request.body).toMatchObject({ turns: 17, keepOut: 1.5e-3 });
  });
});
