import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import type { LossPoint } from '@shared/fitting/loss-points';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { UploadFlow } from '../core/upload-flow';
import { RequestFailureMessage } from '../ui/request-failure';
import { LossPointEntry } from './loss-point-entry';
import { TYPED_POINTS_FILE } from './loss-point-rows';
import { LossPointsApi, type LossPointCommit, type LossPointPreview } from './loss-points-api';

/**
 * A loss-point CSV file: every row with its problems by column and the problems across rows, then all points
 * or none on a new version of the material. (The library import flow decides per existing name; points have none.)
 */
@Component({
  selector: 'gw-loss-point-upload',
  imports: [RequestFailureMessage, LossPointEntry, MatButtonModule, MatProgressBarModule],
  templateUrl: './loss-point-upload.html',
  // The shared import flow's layout (actions row, progress label, error list).
  styleUrl: '../core/csv-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LossPointUpload {
  protected readonly api = inject(LossPointsApi);
  readonly materialId = input.required<string>();
  /** The version's own points, the starting rows of the editable table. */
  readonly points = input<readonly LossPoint[]>([]);
  readonly committed = output<LossPointCommit>();

  protected readonly flow = new UploadFlow<LossPointPreview>();
  protected readonly typedName = TYPED_POINTS_FILE;
  protected readonly problemRows = computed(() => this.flow.preview()?.rows.filter((r) => r.problems.length) ?? []);
  protected readonly canCommit = computed(() => {
    const p = this.flow.preview();
    return this.flow.phase() === 'previewed' && !!p && p.summary.errors === 0 && p.fileProblems.length === 0 && p.summary.valid > 0;
  });

  protected choose(picker: HTMLInputElement): void {
    this.flow.choose(picker, (file) => this.api.preview(this.materialId(), file));
  }

  /** Typed or pasted points, as the file the entry table made of them. */
  protected checkEntered(file: File): void {
    this.flow.take(file, (made) => this.api.preview(this.materialId(), made));
  }

  protected commit(): void {
    if (!this.canCommit()) return;
    this.flow.commit(
      (file) => this.api.commit(this.materialId(), file),
      (done) => this.committed.emit(done),
    );
  }
}
