import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { CoreUpload } from './core-upload';
import type { CoreImportResult } from './cores-api';
import { renderWithHttpTesting } from '../testing/render';

describe('CoreUpload', () => {
  let fixture: ComponentFixture<CoreUpload>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(CoreUpload));
  });

  afterEach(() => http.verify());

  async function chooseFile(content: string): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('input[type="file"][aria-label="Core CSV file"]')!;
    const file = new File([content], 'cores.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;

  it('offers the core template and a file input labelled "Core CSV file"', () => {
    expect(page.querySelector('input[type="file"]')?.getAttribute('aria-label')).toBe('Core CSV file');
    expect(page.querySelector('a[download]')?.getAttribute('href')).toBe('/api/catalogue/cores/template.csv');
  });

  it('shows a progress bar while the file is checked, then each row with its problems by column', async () => {
    await chooseFile('name,kind\nBad,ring\n');
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    expect(page.textContent).toContain('Reading and checking the file…');

    http.expectOne('/api/catalogue/cores/import/preview').flush({
      fileName: 'cores.csv',
      rows: [
        { row: 2, name: 'Good ring', status: 'new', problems: [] },
        { row: 3, name: 'Bad ring', status: 'error', problems: [{ column: 'id_mm', message: 'id_mm must be smaller than od_mm' }] },
      ],
      summary: { rows: 2, new: 1, exists: 0, errors: 1 },
    });
    await fixture.whenStable();

    expect(page.querySelector('mat-progress-bar')).toBeNull();
    expect(page.textContent).toContain('2 rows: 1 new, 0 already among the user cores, 1 with problems.');
    const problems = [...page.querySelectorAll('td.mat-column-problems')].map((td) => td.textContent?.trim());
    expect(problems).toEqual(['—', 'id_mm: id_mm must be smaller than od_mm']);
    expect(button('Import these cores').disabled).toBe(true);
  });

  it('sends "new version" for an existing name with the commit and reports the import', async () => {
    await chooseFile('name\nLab ring\n');
    http.expectOne('/api/catalogue/cores/import/preview').flush({
      fileName: 'cores.csv',
      rows: [{ row: 2, name: 'Lab ring', status: 'exists', problems: [] }],
      summary: { rows: 1, new: 0, exists: 1, errors: 0 },
    });
    await fixture.whenStable();
    expect(page.querySelector('mat-select')?.getAttribute('aria-label')).toBe('What to do with Lab ring');
    let imported: CoreImportResult | undefined;
    fixture.componentInstance.imported.subscribe((result) => (imported = result));

    button('Import these cores').click();
    await fixture.whenStable();
    expect(page.textContent).toContain('Writing the cores…');
    const commit = http.expectOne('/api/catalogue/cores/import/commit');
    const form = commit.request.body as FormData;
    expect(JSON.parse(String(form.get('decisions')))).toEqual({ 'Lab ring': 'new-version' });
    expect((form.get('file') as File).name).toBe('cores.csv');
    commit.flush({ fileName: 'cores.csv', created: 0, versioned: 1, skipped: 0, coreIds: [7] });
    await fixture.whenStable();

    expect(imported).toEqual({ fileName: 'cores.csv', created: 0, versioned: 1, skipped: 0, coreIds: [7] });
    expect(page.querySelector('table')).toBeNull();
  });

  it('shows a refused file’s message and its fields', async () => {
    await chooseFile('a;b\n');
    http.expectOne('/api/catalogue/cores/import/preview').flush(
      {
        error: {
          code: 'invalid_input',
          message: 'The header row is separated by ";"; Gapwright core files use commas.',
          fields: { header: 'Not comma-separated' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    const alert = page.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('Gapwright core files use commas.');
    expect(alert.textContent).toContain('header: Not comma-separated');
    expect(button('Choose a core CSV file…').disabled).toBe(false);
  });
});
