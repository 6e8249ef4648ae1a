import { ChangeDetectionStrategy, Component, inject, output } from '@angular/core';
import type { ImportDecision } from '@shared/schemas/materials';

import { CsvImport, type CsvImportTexts } from '../core/csv-import';
import { MaterialsApi, type CommitResult } from './materials-api';

/** Import materials from a CSV file: preview every row with its problems, decide on existing names, commit all or nothing. */
@Component({
  selector: 'gw-material-upload',
  imports: [CsvImport],
  template: `
    <gw-csv-import
      [texts]="texts"
      templateHref="/api/materials/template.csv"
      [preview]="preview"
      [commit]="commit"
      (imported)="imported.emit($event)"
    />
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialUpload {
  private readonly api = inject(MaterialsApi);
  readonly imported = output<CommitResult>();

  protected readonly texts: CsvImportTexts = {
    fileLabel: 'Material CSV file',
    chooseButton: 'Choose a CSV file…',
    templateLink: 'Download the template',
    existing: 'already in the library',
    writing: 'Writing the materials…',
    commitButton: 'Import these materials',
  };
  protected readonly preview = (file: File) => this.api.preview(file);
  protected readonly commit = (file: File, decisions: Record<string, ImportDecision>) => this.api.commit(file, decisions);
}
