import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { MaterialUpload } from './material-upload';
import { renderWithHttpTesting } from '../testing/render';

describe('MaterialUpload', () => {
  let fixture: ComponentFixture<MaterialUpload>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialUpload));
  });

  afterEach(() => http.verify());

  async function chooseFile(content: string): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('input[type="file"]')!;
    const file = new File([content], 'lab.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;

  it('lists each row with its problems by column and refuses to import', async () => {
    await chooseFile('name,k\nx,-1\n');
    http.expectOne('/api/materials/import/preview').flush({
      fileName: 'lab.csv',
      rows: [{ row: 2, name: 'x', status: 'error', problems: [{ column: 'k', message: 'k must be greater than 0 (got -1)' }] }],
      summary: { rows: 1, new: 0, exists: 0, errors: 1 },
    });
    await fixture.whenStable();

    expect(page.textContent).toContain('1 rows: 0 new, 0 already in the library, 1 with problems.');
    expect(page.querySelector('td.mat-column-problems')?.textContent).toContain('k: k must be greater than 0 (got -1)');
    expect(button('Import these materials').disabled).toBe(true);
  });

  it('shows a row’s notices apart from problems, and the row stays importable', async () => {
    await chooseFile('name,ct0,ct1,ct2\nOld,1.43,0.018,0.0001\n');
    const notice =
      'old columns ct0, ct1, ct2 converted to lowest-loss temperature 90 °C, factor 0.62, curvature 1.0e-4 /K²; ' +
      'this old format is read until the next format version';
    http.expectOne('/api/materials/import/preview').flush({
      fileName: 'old.csv',
      rows: [{ row: 2, name: 'Old', status: 'new', problems: [], notices: [{ column: 'ct0', message: notice }] }],
      summary: { rows: 1, new: 1, exists: 0, errors: 0 },
    });
    await fixture.whenStable();

    const cell = page.querySelector('td.mat-column-problems')!;
    expect(cell.querySelector('.gw-notice')?.textContent).toContain(`Note, ct0: ${notice}`);
    expect(cell.textContent).not.toContain('—');
    expect(button('Import these materials').disabled).toBe(false);
    // http.verify() in afterEach: nothing is committed until the button is pressed.
  });

  it('sends the decision for an existing name with the commit', async () => {
    await chooseFile('name\nLab\n');
    http.expectOne('/api/materials/import/preview').flush({
      fileName: 'lab.csv',
      rows: [{ row: 2, name: 'Lab', status: 'exists', problems: [] }],
      summary: { rows: 1, new: 0, exists: 1, errors: 0 },
    });
    await fixture.whenStable();
    let imported = 0;
    fixture.componentInstance.imported.subscribe((result) => (imported = result.versioned));
    button('Import these materials').click();
    await fixture.whenStable();

    const commit = http.expectOne('/api/materials/import/commit');
    const form = commit.request.body as FormData;
    expect(JSON.parse(String(form.get('decisions')))).toEqual({ Lab: 'new-version' });
    expect((form.get('file') as File).name).toBe('lab.csv');
    commit.flush({ importId: 1, created: 0, versioned: 1, skipped: 0, materialIds: [9] });
    await fixture.whenStable();
    expect(imported).toBe(1);
  });

  it('shows a refused file’s message and its fields', async () => {
    await chooseFile('a;b\n');
    http
      .expectOne('/api/materials/import/preview')
      .flush(
        { error: { code: 'invalid_input', message: 'The header row is separated by ";".', fields: { header: 'Not comma-separated' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    const alert = page.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('The header row is separated by ";".');
    expect(alert.textContent).toContain('header: Not comma-separated');
  });
});
