import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { libraryMaterial } from '../testing/materials';
import { renderWithHttpTesting } from '../testing/render';
import { MATERIAL_COLUMNS_KEY, MaterialLibrary } from './material-library';

// Two invented materials: the first may be edited and retired and carries 27 loss points, the second is retired,
// may only be restored and has no points.
const IN_USE = libraryMaterial({
  canRetire: true,
  lossPointCount: 27,
  fitQuality: { rmsRelativeError: 0.0123, worstRelativeError: 0.0456, pointCount: 27 },
  lowestLossTemperature: 92.4,
});
const RETIRED = libraryMaterial({
  id: '20',
  name: 'Test powder TP-2 (invented)',
  lineage: 'test-powder-tp-2-invented',
  family: 'powder',
  retired: true,
  canEdit: false,
  canRestore: true,
});

describe('MaterialLibrary', () => {
  let fixture: ComponentFixture<MaterialLibrary>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    localStorage.clear();
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialLibrary, {}, { settle: false }));
  });

  afterEach(() => {
    http.verify();
    localStorage.clear();
  });

  async function answer(canImport: boolean): Promise<void> {
    http.expectOne('/api/materials/library').flush({ materials: [IN_USE, RETIRED], canImport });
    http.expectOne('/api/materials/imports').flush({ imports: [] });
    await fixture.whenStable();
  }

  const buttons = () => [...page.querySelectorAll('button')].map((b) => b.getAttribute('aria-label') ?? b.textContent?.trim());
  const rowTexts = () => [...page.querySelectorAll('gw-library-table tr.mat-mdc-row')].map((r) => r.textContent ?? '');
  const headers = () => [...page.querySelectorAll('gw-library-table th')].map((h) => h.textContent?.trim() ?? '');
  /** The text of each cell of the row of `name`, by its column's header. */
  function cellsOf(name: string): Record<string, string> {
    const row = [...page.querySelectorAll('gw-library-table tr.mat-mdc-row')].find((r) => r.textContent?.includes(name))!;
    const cells = [...row.querySelectorAll('td')].map((c) => c.textContent?.replace(/\s+/g, ' ').trim() ?? '');
    return Object.fromEntries(headers().map((h, i) => [h, cells[i]!]));
  }
  const menuItems = () => [...document.querySelectorAll<HTMLButtonElement>('[role="menuitemcheckbox"]')];

  it('lists the materials in the page’s own columns, with the buttons the server allows', async () => {
    await answer(false);
    expect(rowTexts()).toHaveLength(2);
    expect(rowTexts()[0]).toContain('Test ferrite TF-1 (invented)');
    expect(cellsOf('Test ferrite TF-1')).toMatchObject({ 'Fitted f (kHz)': '50–300', 'Fitted B̂ (mT)': '20–250' });
    expect(buttons()).toEqual(
      expect.arrayContaining([
        'Edit Test ferrite TF-1 (invented)',
        'Retire Test ferrite TF-1 (invented)',
        'Restore Test powder TP-2 (invented)',
      ]),
    );
    expect(buttons()).not.toContain('Edit Test powder TP-2 (invented)');
    expect(buttons()).not.toContain('Restore Test ferrite TF-1 (invented)');
    expect(page.textContent).not.toContain('Upload a material CSV file');
  });

  it('shows the data columns in display units, the loss points as a link and the fit quality, “—” without points', async () => {
    await answer(false);
    expect(headers()).toEqual([
      'Select for export',
      'Name',
      'Version',
      'Family',
      'Bsat 25 °C (mT)',
      'Bsat 100 °C (mT)',
      'μi',
      'Lowest loss at (°C)',
      'Fitted f (kHz)',
      'Fitted B̂ (mT)',
      'Loss points',
      'Fit RMS / worst',
      'k · α · β (SI)',
      'State',
      'Actions',
    ]);
    // 0.5 T = 500 mT, 0.4 T = 400 mT; 0.0123 = 1.2 %, 0.0456 = 4.6 % rounded to one decimal (arithmetic).
    expect(cellsOf('Test ferrite TF-1')).toMatchObject({
      'Bsat 25 °C (mT)': '500',
      'Bsat 100 °C (mT)': '400',
      μi: '2,000',
      'Lowest loss at (°C)': '92',
      'Loss points': '27',
      'Fit RMS / worst': '1.2% / 4.6%',
    });
    expect(cellsOf('Test powder TP-2')).toMatchObject({
      'Lowest loss at (°C)': '—',
      'Loss points': '0',
      'Fit RMS / worst': '— no loss points in the fitted ranges',
    });
    const link = page.querySelector<HTMLAnchorElement>('a[aria-label="27 loss points of Test ferrite TF-1 (invented)"]')!;
    expect(link.getAttribute('href')).toBe('/materials/12/loss-points');
  });

  it('shows and hides columns from the Columns menu and keeps the choice in the browser', async () => {
    await answer(false);
    [...page.querySelectorAll('button')].find((b) => b.textContent?.includes('Columns'))!.click();
    await fixture.whenStable();
    const item = (label: string) => menuItems().find((b) => b.textContent?.trim().endsWith(label))!;
    expect(item('Provenance').getAttribute('aria-checked')).toBe('false');
    expect(item('Fit quality').getAttribute('aria-checked')).toBe('true');
    item('Fit quality').click();
    item('Provenance').click();
    await fixture.whenStable();
    expect(headers()).not.toContain('Fit RMS / worst');
    expect(headers()).toContain('Provenance');
    // Name and actions are not in the menu: they are always shown.
    expect(menuItems().map((b) => b.textContent?.trim())).not.toContain('Name');
    expect(headers()[1]).toBe('Name');
    expect(headers().at(-1)).toBe('Actions');

    const stored = JSON.parse(localStorage.getItem(MATERIAL_COLUMNS_KEY)!) as string[];
    expect(stored).toContain('provenance');
    expect(stored).not.toContain('fitQuality');
    // A page opened later starts from the stored choice.
    fixture.destroy();
    TestBed.resetTestingModule();
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialLibrary, {}, { settle: false }));
    await answer(false);
    expect(headers()).toContain('Provenance');
    expect(headers()).not.toContain('Fit RMS / worst');
  });

  it('falls back to the default columns when the stored choice does not read', async () => {
    fixture.destroy();
    TestBed.resetTestingModule();
    localStorage.setItem(MATERIAL_COLUMNS_KEY, '{not json');
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialLibrary, {}, { settle: false }));
    await answer(false);
    expect(headers()).toContain('Fit RMS / worst');
    expect(headers()).not.toContain('Provenance');
  });

  it('offers the upload when the server says this user may import', async () => {
    await answer(true);
    expect(page.textContent).toContain('Upload a material CSV file');
  });

  it('filters the rows and says when none match', async () => {
    await answer(false);
    const filter = page.querySelector<HTMLInputElement>('input[placeholder^="Name, family"]')!;
    filter.value = 'powder';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(rowTexts()).toHaveLength(1);
    expect(rowTexts()[0]).toContain('Test powder TP-2');
    filter.value = 'nothing like it';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(page.querySelector('.gw-no-data')?.textContent).toContain('No materials match “nothing like it”.');
  });

  it('shows every version of a material with the page’s columns, and closes them', async () => {
    await answer(false);
    page.querySelector<HTMLButtonElement>('button[aria-label="Versions of Test ferrite TF-1 (invented)"]')!.click();
    http.expectOne('/api/materials/12/history').flush({
      versions: [IN_USE, libraryMaterial({ id: '11', version: 2, current: false, canEdit: false, createdBy: null })],
    });
    await fixture.whenStable();
    const history = page.querySelector('gw-version-history')!;
    expect(history.querySelector('h2')?.textContent).toBe('Versions of Test ferrite TF-1 (invented)');
    const rows = [...history.querySelectorAll('tr.mat-mdc-row')].map((r) => r.textContent ?? '');
    expect(rows[0]).toContain('v3 (current)');
    expect(rows[0]).toContain('10 · 1.5 · 2.5');
    expect(rows[1]).toContain('v2');
    expect(rows[1]).toContain('demo data');
    [...history.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Close the versions')!.click();
    await fixture.whenStable();
    expect(page.querySelector('gw-version-history')).toBeNull();
  });
});
