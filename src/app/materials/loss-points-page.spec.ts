import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { libraryMaterial } from '../testing/materials';
import { renderWithHttpTesting } from '../testing/render';
import { FIT, POINTS } from './fit-fixture';
import { LossPointsPage } from './loss-points-page';

describe('LossPointsPage', () => {
  let fixture: ComponentFixture<LossPointsPage>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    // The charts never load here: the chart options have their own spec.
    TestBed.configureTestingModule({ providers: [provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) })] });
    ({ fixture, http, page } = await renderWithHttpTesting(LossPointsPage, { id: '7' }, { settle: false }));
    http
      .expectOne('/api/materials/7/loss-points')
      .flush({ materialId: 7, name: 'Demo ferrite Test (illustrative)', version: 3, current: true, canEdit: true, points: POINTS });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;

  it('fits with the chosen options, shows the quality, and accepts the fit as a new version', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    expect(page.querySelectorAll('gw-loss-points-table tbody tr')).toHaveLength(3);
    expect(page.textContent).toContain('makes a new version');
    expect(page.querySelector('.gw-lead')?.textContent).toContain('Version 3 of Demo ferrite Test (illustrative): 3 points');

    button('Fit').click();
    const fit = http.expectOne('/api/materials/7/fit');
    expect(fit.request.body).toEqual({ mode: 'whole', maxWorstError: 0.1, temperature: true, atTemperature: undefined });
    fit.flush(FIT);
    await fixture.whenStable();
    expect(page.querySelector('gw-fit-result .gw-rms')?.textContent).toContain('4.1%');

    button('Accept as new version').click();
    const accept = http.expectOne('/api/materials/7/fit/accept');
    expect(accept.request.body).toMatchObject({ mode: 'whole', temperature: true });
    accept.flush({ material: libraryMaterial({ id: '8', version: 4 }), fit: FIT, band: 0 });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/materials']);
  });

  it('shows the DC-bias loss curve fitted from the points under bias, and says nothing of it when there is none', async () => {
    button('Fit').click();
    http.expectOne('/api/materials/7/fit').flush({
      ...FIT,
      biasLoss: { doublingField: 62.4, steepness: 1.48, rmsRelativeError: 0.02, worstRelativeError: 0.031, worstPoint: 2, pointCount: 1 },
    });
    await fixture.whenStable();
    const text = page.querySelector('gw-fit-result .gw-bias-loss')?.textContent?.replace(/\s+/g, ' ');
    expect(text).toContain('The loss doubles at a DC field of 62.4 A/m in the material and rises with steepness 1.48');
    expect(text).toContain('worst 3.1% (point 3) over the 1 points taken under bias');
    button('Fit').click();
    http.expectOne('/api/materials/7/fit').flush(FIT);
    await fixture.whenStable();
    expect(page.querySelector('gw-fit-result .gw-bias-loss')).toBeNull();
  });

  it('shows the server’s refusal by field beside the fit options', async () => {
    button('Fit').click();
    http.expectOne('/api/materials/7/fit').flush(
      {
        error: {
          code: 'validation',
          message: 'The points cannot give this fit',
          fields: { temperature: 'needs points at 3 or more temperatures' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const alert = page.querySelector('[role="alert"]')!.textContent!;
    expect(alert).toContain('temperature');
    expect(alert).toContain('needs points at 3 or more temperatures');
  });
});
