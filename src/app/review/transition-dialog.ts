import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { Observable } from 'rxjs';

import { showServerFieldErrors } from '../core/server-field-errors';
import { ReviewApi, type TransitionOutcome } from './review-api';

export type TransitionAction = 'submit' | 'approve' | 'return' | 'release';

export interface TransitionDialogData {
  action: TransitionAction;
  revisionId: number;
  /** e.g. "GW-0001 rev 2", named in the question. */
  subject: string;
}

const WORDING: Record<TransitionAction, { title: string; question: string; confirm: string }> = {
  submit: { title: 'Submit for review', question: 'Send {s} to a reviewer? It cannot be edited while in review.', confirm: 'Submit' },
  approve: { title: 'Approve', question: 'Approve {s}? It can then be released to the winding shop.', confirm: 'Approve' },
  return: { title: 'Return with comments', question: 'Send {s} back to its author as a draft?', confirm: 'Return' },
  release: {
    title: 'Release to the winding shop',
    question:
      'Release {s}? The winding sheet is frozen, a build order is created and the shop is e-mailed. A released revision can never be changed.',
    confirm: 'Release',
  },
};

/** Asks once more before a review step, collects its comment (and quantity), and carries it out. */
@Component({
  selector: 'gw-transition-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>{{ wording.title }}</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" novalidate>
      <mat-dialog-content>
        <p>{{ question }}</p>
        @if (data.action === 'release') {
          <mat-form-field class="gw-dialog-field">
            <mat-label>Quantity to build</mat-label>
            <input matInput type="number" inputmode="numeric" min="1" max="100000" step="1" formControlName="quantity" required />
            @if (form.controls.quantity.hasError('server')) {
              <mat-error>{{ form.controls.quantity.getError('server') }}</mat-error>
            } @else if (form.controls.quantity.invalid) {
              <mat-error>Quantity must be a whole number between 1 and 100000</mat-error>
            }
          </mat-form-field>
        }
        <mat-form-field class="gw-dialog-field">
          <mat-label>{{ data.action === 'return' ? 'What needs to change' : 'Comment (optional)' }}</mat-label>
          <textarea matInput rows="3" formControlName="comment" [required]="data.action === 'return'"></textarea>
          @if (form.controls.comment.hasError('server')) {
            <mat-error>{{ form.controls.comment.getError('server') }}</mat-error>
          } @else if (form.controls.comment.hasError('required')) {
            <mat-error>Say what needs to change</mat-error>
          } @else if (form.controls.comment.hasError('maxlength')) {
            <mat-error>At most 2000 characters</mat-error>
          }
        </mat-form-field>
        @if (formError()) {
          <p class="gw-form-error" role="alert">{{ formError() }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">{{ wording.confirm }}</button>
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
export class TransitionDialog {
  protected readonly data = inject<TransitionDialogData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<TransitionDialog, TransitionOutcome>>(MatDialogRef);
  private readonly api = inject(ReviewApi);

  protected readonly wording = WORDING[this.data.action];
  protected readonly question = this.wording.question.replace('{s}', this.data.subject);
  protected readonly busy = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected readonly form = new FormGroup({
    comment: new FormControl('', {
      nonNullable: true,
      validators: this.data.action === 'return' ? [Validators.required, Validators.maxLength(2000)] : [Validators.maxLength(2000)],
    }),
    quantity: new FormControl<number | null>(this.data.action === 'release' ? 1 : null, {
      validators:
        this.data.action === 'release' ? [Validators.required, Validators.min(1), Validators.max(100000), Validators.pattern(/^\d+$/)] : [],
    }),
  });

  protected confirm(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const comment = this.form.controls.comment.value.trim() || undefined;
    const request = this.request(comment);
    this.busy.set(true);
    this.formError.set(null);
    request.subscribe({
      next: (outcome) => this.dialogRef.close(outcome),
      error: (error: unknown) => {
        this.busy.set(false);
        this.formError.set(showServerFieldErrors(this.form, error));
      },
    });
  }

  private request(comment: string | undefined): Observable<TransitionOutcome> {
    const id = this.data.revisionId;
    switch (this.data.action) {
      case 'submit':
        return this.api.submit(id, comment);
      case 'approve':
        return this.api.approve(id, comment);
      case 'return':
        return this.api.returnToDraft(id, comment ?? '');
      case 'release':
        return this.api.release(id, Number(this.form.controls.quantity.value), comment);
    }
  }
}
