import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { voidUnit } from '@shared/api/shop';
import type { RecordedUnit } from '@shared/schemas/shop';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { FormSubmission } from '../core/form-submission';
import { showServerFieldErrors } from '../core/server-field-errors';

export interface VoidUnitDialogData {
  unitId: number;
  /** e.g. "unit 3 of BO-0001", named in the question. */
  subject: string;
}

/** Voids a wrong unit record with a reason: the record stays, struck through, and its number can be recorded again. */
@Component({
  selector: 'gw-void-unit-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>Void a unit record</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" novalidate>
      <mat-dialog-content>
        <p>
          Void the record of {{ data.subject }}? It stays in the order, struck through with your reason, and no longer counts; the unit can
          then be recorded again.
        </p>
        <mat-form-field class="gw-dialog-field">
          <mat-label>Reason</mat-label>
          <textarea matInput rows="3" formControlName="reason" required></textarea>
          @if (form.controls.reason.hasError('server')) {
            <mat-error>{{ form.controls.reason.getError('server') }}</mat-error>
          } @else if (form.controls.reason.invalid) {
            <mat-error>Give a reason of 3 to 500 characters</mat-error>
          }
        </mat-form-field>
        @if (submission.failure(); as failure) {
          <p class="gw-form-error" role="alert">{{ failure }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="submission.submitting()">Void record</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .gw-dialog-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VoidUnitDialog {
  protected readonly data = inject<VoidUnitDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<VoidUnitDialog, RecordedUnit>>(MatDialogRef);
  private readonly api = inject(Api);

  protected readonly submission = new FormSubmission();
  protected readonly form = new FormGroup({
    reason: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(3), Validators.maxLength(500)],
    }),
  });

  protected confirm(): void {
    const body = () => ({ reason: this.form.controls.reason.value.trim() });
    this.submission.send(
      this.form,
      () => this.api.call(voidUnit, { params: { id: String(this.data.unitId) }, body: body() }, errorsShownByCaller()),
      { done: (outcome) => this.dialogRef.close(outcome), describe: (error) => showServerFieldErrors(this.form, error) },
    );
  }
}
