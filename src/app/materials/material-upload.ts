import { ChangeDetectionStrategy, Component, computed, inject, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import type { ImportDecision, ImportPreview } from '@shared/schemas/materials';

import { apiErrorOf, errorMessageOf } from '../core/api-error';
import { MaterialsApi, type CommitResult } from './materials-api';

type Phase = 'idle' | 'previewing' | 'previewed' | 'committing';

/** Choose a CSV file, see every row with its problems, decide on existing names, commit all or nothing. */
@Component({
  selector: 'gw-material-upload',
  imports: [MatButtonModule, MatFormFieldModule, MatProgressBarModule, MatSelectModule, MatTableModule],
  templateUrl: './material-upload.html',
  styleUrl: './material-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialUpload {
  private readonly api = inject(MaterialsApi);
  readonly imported = output<CommitResult>();

  protected readonly phase = signal<Phase>('idle');
  protected readonly percent = signal<number | null>(null);
  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<ImportPreview | null>(null);
  protected readonly failure = signal<{ message: string; fields: [string, string][] } | null>(null);
  protected readonly decisions = signal<Record<string, ImportDecision>>({});
  protected readonly columns = ['row', 'name', 'status', 'problems', 'decision'];
  protected readonly busy = computed(() => this.phase() === 'previewing' || this.phase() === 'committing');
  protected readonly canCommit = computed(() => {
    const preview = this.preview();
    return this.phase() === 'previewed' && !!preview && preview.summary.errors === 0 && preview.summary.rows > 0;
  });

  protected choose(input: HTMLInputElement): void {
    const file = input.files?.[0] ?? null;
    input.value = '';
    if (!file) return;
    this.file.set(file);
    this.preview.set(null);
    this.failure.set(null);
    this.phase.set('previewing');
    this.percent.set(0);
    this.api.preview(file).subscribe({
      next: (step) => {
        if (step.kind === 'progress') {
          this.percent.set(step.percent);
          return;
        }
        const decisions: Record<string, ImportDecision> = {};
        for (const row of step.body.rows) if (row.status === 'exists') decisions[row.name] = 'new-version';
        this.decisions.set(decisions);
        this.preview.set(step.body);
        this.phase.set('previewed');
      },
      error: (error: unknown) => this.fail(error),
    });
  }

  protected decide(name: string, decision: ImportDecision): void {
    this.decisions.update((all) => ({ ...all, [name]: decision }));
  }

  protected commit(): void {
    const file = this.file();
    if (!file || !this.canCommit()) return;
    this.phase.set('committing');
    this.percent.set(0);
    this.api.commit(file, this.decisions()).subscribe({
      next: (step) => {
        if (step.kind === 'progress') {
          this.percent.set(step.percent);
          return;
        }
        this.phase.set('idle');
        this.preview.set(null);
        this.file.set(null);
        this.imported.emit(step.body);
      },
      error: (error: unknown) => this.fail(error),
    });
  }

  protected cancel(): void {
    this.phase.set('idle');
    this.preview.set(null);
    this.file.set(null);
    this.failure.set(null);
  }

  private fail(error: unknown): void {
    this.phase.set(this.preview() ? 'previewed' : 'idle');
    this.failure.set({ message: errorMessageOf(error), fields: Object.entries(apiErrorOf(error)?.fields ?? {}).slice(0, 50) });
  }
}
