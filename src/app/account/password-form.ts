import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { PASSWORD_MAX, PASSWORD_MIN } from '@shared/schemas/auth';

import { showServerFieldErrors } from '../core/server-field-errors';
import { Notifier } from '../core/notifier';
import { AccountApi } from './account-api';
import { matchingSibling } from './matching-sibling';

@Component({
  selector: 'gw-password-form',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './password-form.html',
  styleUrl: './password-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordForm {
  private readonly accountApi = inject(AccountApi);
  private readonly notifier = inject(Notifier);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected readonly minLength = PASSWORD_MIN;
  protected readonly maxLength = PASSWORD_MAX;
  protected readonly form = new FormGroup({
    currentPassword: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    newPassword: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(PASSWORD_MIN), Validators.maxLength(PASSWORD_MAX)],
    }),
    confirmPassword: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, matchingSibling('newPassword')],
    }),
  });
  protected readonly submitting = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    // A changed new password can make an already typed confirmation right or wrong.
    this.form.controls.newPassword.valueChanges
      .pipe(takeUntilDestroyed(inject(DestroyRef)))
      .subscribe(() => this.form.controls.confirmPassword.updateValueAndValidity({ emitEvent: false }));
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.submitting.set(true);
    this.failure.set(null);
    this.accountApi.changePassword({ currentPassword, newPassword }).subscribe({
      next: () => {
        this.submitting.set(false);
        this.formDirective().resetForm();
        this.notifier.info('Your password has been changed.');
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.failure.set(showServerFieldErrors(this.form, error));
      },
    });
  }
}
