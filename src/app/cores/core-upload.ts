import { ChangeDetectionStrategy, Component, inject, output } from '@angular/core';

import { CsvImport, csvImportTexts } from '../core/csv-import';
import { CoresApi, type CoreImportResult } from './cores-api';

/** Import user cores from a CSV file: the format in a sentence, then preview and all-or-nothing commit. */
@Component({
  selector: 'gw-core-upload',
  imports: [CsvImport],
  templateUrl: './core-upload.html',
  styleUrl: './core-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreUpload {
  protected readonly api = inject(CoresApi);
  readonly imported = output<CoreImportResult>();
  protected readonly texts = csvImportTexts('core', 'cores', 'already among the user cores');
}
