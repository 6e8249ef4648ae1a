import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import type { CompareDesignResponse } from '@shared/schemas/compare';
import { afterEach, describe, expect, it } from 'vitest';

import { designDetail, revisionSummary } from '../testing/designs';
import { fieldLabelled, typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';
import { DesignComparison } from './design-comparison';

// Invented figures: the component only lays them out, the API tests check the physics.
const RESPONSE: CompareDesignResponse = {
  engineVersion: 'test',
  design: { id: 5, number: 'GW-0005', title: 'Sample rail', revision: 2, materialId: '11' },
  coreId: 'ETD34/17/11',
  turns: 21,
  placement: 'ground',
  rows: [
    {
      materialId: '11',
      usedByDesign: true,
      name: 'Sample ferrite A',
      family: 'ferrite',
      status: 'ok',
      feasible: true,
      gap: 0.0011,
      coreLoss: 0.4,
      copperLoss: 1.1,
      totalLoss: 1.5,
      temperatureRise: 31,
    },
    { materialId: '12', name: 'Sample powder B', family: 'powder', status: 'incompatible', reason: 'needs a ring' },
  ],
};

describe('DesignComparison', () => {
  let fixture: ComponentFixture<DesignComparison>;
  let http: HttpTestingController;
  let page: HTMLElement;

  afterEach(() => http.verify());

  async function openedOnRevision(): Promise<void> {
    ({ fixture, http, page } = await renderWithHttpTesting(DesignComparison, { designId: '5', revision: '2' }, { settle: false }));
    http.expectOne((r) => r.url === '/api/designs').flush({ items: [], total: 0, page: 0, pageSize: 100 });
    http.expectOne('/api/catalogue/cores').flush({ cores: [] });
    http.expectOne('/api/designs/5').flush(designDetail({ revisions: [revisionSummary({ id: 9, revision: 2, totalLoss: 1.5 })] }));
  }

  it('compares the revision named by the page at once and marks the material the design was built with', async () => {
    await openedOnRevision();
    const request = http.expectOne('/api/compare/saved-design');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ designId: 5, revision: 2 });
    request.flush(RESPONSE);
    await fixture.whenStable();
    expect(page.querySelector('h3')?.textContent?.trim()).toBe(
      'GW-0005 revision 2 · Sample rail: ETD34/17/11, 21 turns, ground centre gap',
    );
    const own = page.querySelector('tr.gw-own-row');
    expect(own?.textContent).toContain('Sample ferrite A');
    expect(own?.textContent).toContain("this design's material");
    expect(page.querySelectorAll('tr.gw-own-row')).toHaveLength(1);
    expect(page.textContent).toContain('Does not fit this core');
    expect(page.querySelector('gw-caution-line')).not.toBeNull();
  });

  it('puts the server’s message about the revision under the revision field', async () => {
    await openedOnRevision();
    http.expectOne('/api/compare/saved-design').flush(
      {
        error: {
          code: 'conflict',
          message: 'GW-0005 revision 2 has no construction yet.',
          fields: { revision: 'No construction to compare' },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect([...page.querySelectorAll('mat-error')].map((e) => e.textContent?.trim())).toEqual(['No construction to compare']);
    expect(page.querySelector('table')).toBeNull();
  });

  it('reads the typed-in converter with units and sends it in SI', async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(DesignComparison, {}, { settle: false }));
    http.expectOne((r) => r.url === '/api/designs').flush({ items: [], total: 0, page: 0, pageSize: 100 });
    http.expectOne('/api/catalogue/cores').flush({ cores: [] });
    await fixture.whenStable();
    [...page.querySelectorAll('button')].find((b) => b.textContent?.includes('A design typed in here'))!.click();
    await fixture.whenStable();
    expect(fieldLabelled(page, 'Switching frequency').value).toBe('100 kHz');
    expect(fieldLabelled(page, 'Vin min').value).toBe('24 V');

    typeInto(page, 'Switching frequency', '250kHz', { leave: true });
    typeInto(page, 'Vin max', '48');
    typeInto(page, 'Ripple ratio ΔI/Iout', '40 %');
    await fixture.whenStable();
    expect(fieldLabelled(page, 'Switching frequency').value).toBe('250 kHz');
    [...page.querySelectorAll<HTMLButtonElement>('button[type="submit"]')]
      .find((b) => b.textContent?.includes('Compare on this design'))!
      .click();

    const request = http.expectOne('/api/compare/design');
    // 250 kHz = 250 000 Hz, 40 % = 0.4: SI prefixes and per cent (BIPM SI Brochure, 9th ed. — from memory).
    expect(request.request.body.spec).toEqual({ vinMin: 24, vinMax: 48, vout: 12, ioutMax: 10, frequency: 250e3, rippleRatio: 0.4 });
    // A typed-in design is compared with a ground centre gap unless the spacer is chosen.
    expect(request.request.body.placement).toBe('ground');
    request.flush({ ...RESPONSE, design: undefined, placement: 'spacer' });
    await fixture.whenStable();
    // The gap column names what each row's figure is: a spacer's thickness, not a ground gap.
    const headers = [...page.querySelectorAll('th')].map((th) => th.textContent?.trim());
    expect(headers).toContain('Spacer (mm)');
    expect(page.querySelector('h3')?.textContent).toContain('spacer under all legs');
  });
});
