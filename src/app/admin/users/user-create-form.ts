import { ChangeDetectionStrategy, Component, inject, output, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { PASSWORD_MAX, PASSWORD_MIN, ROLES, type AdminUser, type Role } from '@shared/schemas/auth';

import { FormSubmission } from '../../core/form-submission';
import { showServerFieldErrors } from '../../core/server-field-errors';
import { ROLE_LABELS } from '../../core/roles';
import { UsersApi } from './users-api';

const USERNAME_PATTERN = /^[a-z0-9._-]+$/;

@Component({
  selector: 'gw-user-create-form',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './user-create-form.html',
  styleUrl: './user-create-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserCreateForm {
  private readonly usersApi = inject(UsersApi);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  readonly created = output<AdminUser>();

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly passwordMin = PASSWORD_MIN;
  protected readonly passwordMax = PASSWORD_MAX;
  protected readonly form = new FormGroup({
    username: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(3), Validators.maxLength(40), Validators.pattern(USERNAME_PATTERN)],
    }),
    displayName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(80)] }),
    email: new FormControl('', { nonNullable: true, validators: [Validators.email, Validators.maxLength(200)] }),
    role: new FormControl<Role>('engineer', { nonNullable: true, validators: [Validators.required] }),
    password: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(PASSWORD_MIN), Validators.maxLength(PASSWORD_MAX)],
    }),
  });
  protected readonly submission = new FormSubmission();

  protected submit(): void {
    const { username, displayName, email, role, password } = this.form.getRawValue();
    this.submission.send(
      this.form,
      () =>
        this.usersApi.create({ username: username.trim(), displayName: displayName.trim(), email: email.trim() || null, role, password }),
      {
        done: (user) => {
          this.formDirective().resetForm({ role: 'engineer' });
          this.created.emit(user);
        },
        describe: (error) => showServerFieldErrors(this.form, error),
      },
    );
  }
}
