import { ChangeDetectionStrategy, Component, inject, output } from '@angular/core';

import { CsvImport, csvImportTexts } from '../core/csv-import';
import { MaterialsApi, type CommitResult } from './materials-api';

/** Import materials from a CSV file: preview every row with its problems, decide on existing names, commit all or nothing. */
@Component({
  selector: 'gw-material-upload',
  imports: [CsvImport],
  template: `
    <gw-csv-import [texts]="texts" templateHref="/api/materials/template.csv" [calls]="api.csvImport" (imported)="imported.emit($event)" />
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialUpload {
  protected readonly api = inject(MaterialsApi);
  readonly imported = output<CommitResult>();
  protected readonly texts = csvImportTexts('material', 'materials', 'already in the library');
}
