import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { ImportDecision, ImportPreview } from '@shared/schemas/csv-import';
import type { Observable } from 'rxjs';

import { DataTable, DataTableCell, type TableColumn } from '../ui/data-table';
import type { CsvImportCalls, UploadStep } from './upload-steps';
import { RequestFailureMessage, requestFailureOf, type RequestFailure } from '../ui/request-failure';

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

type Phase = 'idle' | 'previewing' | 'previewed' | 'committing';
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
  protected readonly phase = signal<Phase>('idle');
  protected readonly percent = signal<number | null>(null);
  protected readonly file = signal<File | null>(null);
  protected readonly result = signal<ImportPreview | null>(null);
  protected readonly failure = signal<RequestFailure | null>(null);
  protected readonly decisions = signal<Record<string, ImportDecision>>({});
  protected readonly columns: TableColumn<ImportPreview['rows'][number]>[] = [
    { name: 'row', header: 'Row', text: (row) => row.row },
    { name: 'name', header: 'Name', text: (row) => row.name || null },
    { name: 'status', header: 'Status' },
    { name: 'problems', header: 'Problems (column: message)' },
    { name: 'decision', header: 'Decision' },
  ];
  protected readonly busy = computed(() => this.phase() === 'previewing' || this.phase() === 'committing');
  protected readonly canCommit = computed(() => {
    const preview = this.result();
    return this.phase() === 'previewed' && !!preview && preview.summary.errors === 0 && preview.summary.rows > 0;
  });

  protected choose(input: HTMLInputElement): void {
    const file = input.files?.[0] ?? null;
    input.value = '';
    if (!file) return;
    this.file.set(file);
    this.result.set(null);
    this.failure.set(null);
    this.run('previewing', this.calls().preview(file), (preview) => {
      // Existing names start as "new version": re-uploading a corrected file is the common case.
      this.decisions.set(
        Object.fromEntries(preview.rows.filter((r) => r.status === 'exists').map((r) => [r.name, 'new-version' as const])),
      );
      this.result.set(preview);
      this.phase.set('previewed');
    });
  }

  protected decide(name: string, decision: ImportDecision): void {
    this.decisions.update((all) => ({ ...all, [name]: decision }));
  }

  protected importAll(): void {
    const file = this.file();
    if (!file || !this.canCommit()) return;
    this.run('committing', this.calls().commit(file, this.decisions()), (done) => {
      this.reset();
      this.imported.emit(done);
    });
  }

  protected reset(): void {
    this.phase.set('idle');
    this.result.set(null);
    this.file.set(null);
    this.failure.set(null);
  }

  /** One upload: progress while it travels, then the answer, or the server's refusal with its fields. */
  private run<T>(phase: Phase, steps: Observable<UploadStep<T>>, done: (body: T) => void): void {
    this.phase.set(phase);
    this.percent.set(0);
    steps.subscribe({
      next: (step) => (step.kind === 'progress' ? this.percent.set(step.percent) : done(step.body)),
      error: (error: unknown) => {
        this.phase.set(this.result() ? 'previewed' : 'idle');
        this.failure.set(requestFailureOf(error));
      },
    });
  }
}
