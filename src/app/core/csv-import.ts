import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { ImportDecision, ImportPreview } from '@shared/schemas/csv-import';

import { DataTable, DataTableCell, type TableColumn } from '../ui/data-table';
import { RequestFailureMessage } from '../ui/request-failure';
import { UploadFlow } from './upload-flow';
import type { CsvImportCalls } from './upload-steps';

/** The words of one CSV import (cores, materials). */
export interface CsvImportTexts {
  /** Accessible name of the file input, e.g. "Core CSV file". */
  fileLabel: string;
  chooseButton: string;
  templateLink: string;
  /** How the summary names rows whose name is already stored, e.g. "already among the user cores". */
  existing: string;
  /** Shown while the commit is written, e.g. "Writing the cores…". */
  writing: string;
  commitButton: string;
}

/**
 * The words of a library's import from its nouns, e.g. ("material", "materials", "already in the library"):
 * "Material CSV file", "Choose a material CSV file…", "Import these materials".
 */
export function csvImportTexts(noun: string, plural: string, existing: string): CsvImportTexts {
  return {
    fileLabel: `${noun.charAt(0).toUpperCase()}${noun.slice(1)} CSV file`,
    chooseButton: `Choose a ${noun} CSV file…`,
    templateLink: `Download the ${noun} template`,
    existing,
    writing: `Writing the ${plural}…`,
    commitButton: `Import these ${plural}`,
  };
}

let nextId = 0;

/**
 * Choose a CSV file, see every row with its problems by column, decide on existing names, then commit all
 * or nothing. The feature gives the words, the template address and its two upload calls.
 */
@Component({
  selector: 'gw-csv-import',
  imports: [RequestFailureMessage, DataTable, DataTableCell, MatButtonModule, MatFormFieldModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './csv-import.html',
  styleUrl: './csv-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CsvImport<R> {
  readonly texts = input.required<CsvImportTexts>();
  readonly templateHref = input.required<string>();
  /** The feature's two upload calls: the preview, then the commit with a decision per existing name. */
  readonly calls = input.required<CsvImportCalls<ImportPreview, R>>();
  readonly imported = output<R>();

  protected readonly progressLabelId = `gw-csv-import-progress-${nextId++}`;
  private readonly flow = new UploadFlow<ImportPreview>();
  protected readonly phase = this.flow.phase;
  protected readonly percent = this.flow.percent;
  protected readonly file = this.flow.file;
  protected readonly result = this.flow.preview;
  protected readonly failure = this.flow.failure;
  protected readonly busy = this.flow.busy;
  protected readonly decisions = signal<Record<string, ImportDecision>>({});
  protected readonly columns: TableColumn<ImportPreview['rows'][number]>[] = [
    { name: 'row', header: 'Row', text: (row) => row.row },
    { name: 'name', header: 'Name', text: (row) => row.name || null },
    { name: 'status', header: 'Status' },
    { name: 'problems', header: 'Problems and notes (column: message)' },
    { name: 'decision', header: 'Decision' },
  ];
  protected readonly canCommit = computed(() => {
    const preview = this.result();
    return this.phase() === 'previewed' && !!preview && preview.summary.errors === 0 && preview.summary.rows > 0;
  });

  protected choose(picker: HTMLInputElement): void {
    this.flow.choose(picker, this.calls().preview, (preview) =>
      // Existing names start as "new version": re-uploading a corrected file is the common case.
      this.decisions.set(
        Object.fromEntries(preview.rows.filter((r) => r.status === 'exists').map((r) => [r.name, 'new-version' as const])),
      ),
    );
  }

  protected decide(name: string, decision: ImportDecision): void {
    this.decisions.update((all) => ({ ...all, [name]: decision }));
  }

  protected importAll(): void {
    if (!this.canCommit()) return;
    this.flow.commit(
      (file) => this.calls().commit(file, this.decisions()),
      (done) => this.imported.emit(done),
    );
  }

  protected reset(): void {
    this.flow.reset();
  }
}
