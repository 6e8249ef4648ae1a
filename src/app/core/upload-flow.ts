import { computed, signal } from '@angular/core';
import type { Observable } from 'rxjs';

import { requestFailureOf, type RequestFailure } from '../ui/request-failure';
import type { UploadStep } from './upload-steps';

export type UploadPhase = 'idle' | 'previewing' | 'previewed' | 'committing';

/**
 * The state of a preview-then-commit file upload (the CSV imports, the loss points): the phase, the upload's
 * progress, the chosen file, the preview, and the server's refusal with its fields. Create it in a component field.
 */
export class UploadFlow<P> {
  readonly phase = signal<UploadPhase>('idle');
  readonly percent = signal<number | null>(null);
  readonly file = signal<File | null>(null);
  readonly preview = signal<P | null>(null);
  readonly failure = signal<RequestFailure | null>(null);
  readonly busy = computed(() => this.phase() === 'previewing' || this.phase() === 'committing');

  /** The picker's file (the picker is emptied so the same file can be chosen again after a fix), previewed. */
  choose(picker: HTMLInputElement, preview: (file: File) => Observable<UploadStep<P>>, before?: (preview: P) => void): void {
    const file = picker.files?.[0] ?? null;
    picker.value = '';
    if (file) this.take(file, preview, before);
  }

  /** A file made here (typed points, say) rather than chosen, previewed like a chosen one. */
  take(file: File, preview: (file: File) => Observable<UploadStep<P>>, before?: (preview: P) => void): void {
    this.file.set(file);
    this.preview.set(null);
    this.failure.set(null);
    this.run('previewing', preview(file), (answer) => {
      before?.(answer);
      this.preview.set(answer);
      this.phase.set('previewed');
    });
  }

  /** The chosen file's commit; on success the flow starts again and `done` has the answer. */
  commit<R>(commit: (file: File) => Observable<UploadStep<R>>, done: (answer: R) => void): void {
    const file = this.file();
    if (!file) return;
    this.run('committing', commit(file), (answer) => {
      this.reset();
      done(answer);
    });
  }

  reset(): void {
    this.phase.set('idle');
    this.preview.set(null);
    this.file.set(null);
    this.failure.set(null);
  }

  /** One upload: progress while it travels, then the answer, or the server's refusal with its fields. */
  private run<T>(phase: UploadPhase, steps: Observable<UploadStep<T>>, done: (body: T) => void): void {
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
