import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Observable } from 'rxjs';

import type { UploadStep } from '../core/upload-steps';
import { LossPointsApi, type LossPointCommit, type LossPointPreview } from './loss-points-api';
import { RequestFailureMessage, requestFailureOf, type RequestFailure } from '../ui/request-failure';

type Phase = 'idle' | 'previewing' | 'previewed' | 'committing';

/**
 * A loss-point CSV file: every row with its problems by column and the problems across rows, then all points
 * or none on a new version of the material. (The library import flow decides per existing name; points have none.)
 */
@Component({
  selector: 'gw-loss-point-upload',
  imports: [RequestFailureMessage, MatButtonModule, MatProgressBarModule],
  templateUrl: './loss-point-upload.html',
  // The shared import flow's layout (actions row, progress label, error list).
  styleUrl: '../core/csv-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LossPointUpload {
  protected readonly api = inject(LossPointsApi);
  readonly materialId = input.required<string>();
  readonly committed = output<LossPointCommit>();

  protected readonly phase = signal<Phase>('idle');
  protected readonly percent = signal<number | null>(null);
  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<LossPointPreview | null>(null);
  protected readonly failure = signal<RequestFailure | null>(null);
  protected readonly busy = computed(() => this.phase() === 'previewing' || this.phase() === 'committing');
  protected readonly problemRows = computed(() => this.preview()?.rows.filter((r) => r.problems.length) ?? []);
  protected readonly canCommit = computed(() => {
    const p = this.preview();
    return this.phase() === 'previewed' && !!p && p.summary.errors === 0 && p.fileProblems.length === 0 && p.summary.valid > 0;
  });

  protected choose(picker: HTMLInputElement): void {
    const file = picker.files?.[0] ?? null;
    picker.value = '';
    if (!file) return;
    this.file.set(file);
    this.preview.set(null);
    this.failure.set(null);
    this.run('previewing', this.api.preview(this.materialId(), file), (preview) => {
      this.preview.set(preview);
      this.phase.set('previewed');
    });
  }

  protected commit(): void {
    const file = this.file();
    if (!file || !this.canCommit()) return;
    this.run('committing', this.api.commit(this.materialId(), file), (done) => {
      this.reset();
      this.committed.emit(done);
    });
  }

  protected reset(): void {
    this.phase.set('idle');
    this.preview.set(null);
    this.file.set(null);
    this.failure.set(null);
  }

  private run<T>(phase: Phase, steps: Observable<UploadStep<T>>, done: (body: T) => void): void {
    this.phase.set(phase);
    this.percent.set(0);
    steps.subscribe({
      next: (step) => (step.kind === 'progress' ? this.percent.set(step.percent) : done(step.body)),
      error: (error: unknown) => {
        this.phase.set(this.preview() ? 'previewed' : 'idle');
        this.failure.set(requestFailureOf(error));
      },
    });
  }
}
