import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { PASSWORD_MAX, signInRequestSchema } from '@shared/schemas/auth';

import { Session } from '../core/session';
import { safeReturnUrl } from './return-url';
import { signInFailureMessage } from './sign-in-failure';

@Component({
  selector: 'gw-sign-in',
  imports: [MatButtonModule, MatCardModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly router = inject(Router);
  private readonly session = inject(Session);

  /** Bound from the `returnUrl` query parameter. */
  readonly returnUrl = input<string | undefined>();

  protected readonly form = new FormGroup({
    username: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(40)] }),
    password: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(PASSWORD_MAX)],
    }),
  });
  protected readonly submitting = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.failure.set(null);
    this.session.signIn(signInRequestSchema.parse(this.form.getRawValue())).subscribe({
      next: () => void this.router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      error: (error: unknown) => {
        this.submitting.set(false);
        this.failure.set(signInFailureMessage(error));
      },
    });
  }
}
