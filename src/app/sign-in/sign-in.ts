import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { PASSWORD_MAX, signInRequestSchema } from '@shared/schemas/auth';

import { FormSubmission } from '../core/form-submission';
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
  protected readonly submission = new FormSubmission();

  protected submit(): void {
    this.submission.send(this.form, () => this.session.signIn(signInRequestSchema.parse(this.form.getRawValue())), {
      done: () => void this.router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      describe: signInFailureMessage,
      staysBusy: true,
    });
  }
}
