import { ChangeDetectionStrategy, Component, inject, output } from '@angular/core';
import type { ImportDecision } from '@shared/schemas/core-csv';

import { CsvImport, type CsvImportTexts } from '../core/csv-import';
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
  private readonly api = inject(CoresApi);
  readonly imported = output<CoreImportResult>();

  protected readonly texts: CsvImportTexts = {
    fileLabel: 'Core CSV file',
    chooseButton: 'Choose a core CSV file…',
    templateLink: 'Download the core template',
    existing: 'already among the user cores',
    writing: 'Writing the cores…',
    commitButton: 'Import these cores',
  };
  protected readonly preview = (file: File) => this.api.previewImport(file);
  protected readonly commit = (file: File, decisions: Record<string, ImportDecision>) => this.api.commitImport(file, decisions);
}
