import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { libraryMaterial } from '../testing/materials';
import { renderWithHttpTesting } from '../testing/render';
import { MaterialLibrary } from './material-library';

// Two invented materials: the first may be edited and retired, the second is retired and may only be restored.
const IN_USE = libraryMaterial({ canRetire: true });
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
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialLibrary, {}, { settle: false }));
  });

  afterEach(() => http.verify());

  async function answer(canImport: boolean): Promise<void> {
    http.expectOne('/api/materials/library').flush({ materials: [IN_USE, RETIRED], canImport });
    http.expectOne('/api/materials/imports').flush({ imports: [] });
    await fixture.whenStable();
  }

  const buttons = () => [...page.querySelectorAll('button')].map((b) => b.getAttribute('aria-label') ?? b.textContent?.trim());
  const rowTexts = () => [...page.querySelectorAll('gw-library-table tr.mat-mdc-row')].map((r) => r.textContent ?? '');

  it('lists the materials in the page’s own columns, with the buttons the server allows', async () => {
    await answer(false);
    expect(rowTexts()).toHaveLength(2);
    expect(rowTexts()[0]).toContain('Test ferrite TF-1 (invented)');
    expect(rowTexts()[0]).toContain('50–300 kHz');
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
