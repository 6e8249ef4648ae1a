import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { listedUserRing } from '../testing/cores';
import { renderWithHttpTesting } from '../testing/render';
import { CoreCatalogue } from './core-catalogue';

// An invented shipped set beside the invented user ring: shipped cores allow nothing.
const SHIPPED = listedUserRing({
  id: 'Sample E 30 (invented)',
  family: 'E',
  gapKind: 'air-gap',
  ring: undefined,
  source: 'invented shipped sample',
  origin: 'shipped',
  userCoreId: undefined,
  version: undefined,
  createdBy: undefined,
  createdAt: undefined,
  canEdit: false,
});

describe('CoreCatalogue', () => {
  let fixture: ComponentFixture<CoreCatalogue>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(CoreCatalogue, {}, { settle: false }));
  });

  afterEach(() => http.verify());

  async function answer(ring = listedUserRing()): Promise<void> {
    http.expectOne('/api/catalogue/cores').flush({ cores: [SHIPPED, ring] });
    await fixture.whenStable();
  }

  const labels = () => [...page.querySelectorAll('gw-record-actions button')].map((b) => b.getAttribute('aria-label'));
  const rowTexts = () => [...page.querySelectorAll('gw-library-table tr.mat-mdc-row')].map((r) => r.textContent ?? '');

  it('shows the buttons the server allows on user cores and none on shipped cores', async () => {
    await answer();
    expect(rowTexts()).toHaveLength(2);
    // Ae 33.63 mm², Ap 2.64e-9 m⁴ = 0.264 cm⁴ (the fixture's own numbers in display units)
    expect(rowTexts()[1]).toContain('33.6');
    expect(rowTexts()[1]).toContain('0.264');
    expect(labels()).toEqual(['Versions of Lab ring 20/10/7', 'Edit Lab ring 20/10/7']);
  });

  it('offers restore for a retired core the user may curate', async () => {
    await answer(listedUserRing({ retired: true, canRestore: true }));
    expect(labels()).toEqual(['Versions of Lab ring 20/10/7', 'Edit Lab ring 20/10/7', 'Restore Lab ring 20/10/7']);
    expect(rowTexts().join()).toContain('Erin Calder (v2), retired');
  });

  it('filters by name or source', async () => {
    await answer();
    const filter = page.querySelector<HTMLInputElement>('.gw-filters input')!;
    filter.value = 'shipped sample';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(rowTexts()).toHaveLength(1);
    expect(rowTexts()[0]).toContain('Sample E 30 (invented)');
  });

  it('shows the versions of a user core with its dimensions in mm', async () => {
    await answer();
    page.querySelector<HTMLButtonElement>('button[aria-label="Versions of Lab ring 20/10/7"]')!.click();
    http.expectOne('/api/catalogue/cores/7/history').flush({
      versions: [listedUserRing(), listedUserRing({ userCoreId: 6, version: 1, createdBy: null, canEdit: false })],
    });
    await fixture.whenStable();
    const history = page.querySelector('gw-version-history')!;
    expect(history.querySelector('h2')?.textContent).toBe('Versions of Lab ring 20/10/7');
    expect(history.textContent).toContain('A new version comes from');
    const rows = [...history.querySelectorAll('tr.mat-mdc-row')].map((r) => r.textContent ?? '');
    expect(rows[0]).toContain('v2');
    expect(rows[0]).not.toContain('(current)');
    expect(rows[0]).toContain('33.6');
    expect(rows[1]).toContain('—');
  });
});
