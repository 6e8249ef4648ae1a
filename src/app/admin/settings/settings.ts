import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { Notifier } from '../../core/notifier';
import { showServerFieldErrors } from '../../core/server-field-errors';
import { SettingsApi } from './settings-api';

/** Application settings an administrator keeps: where released winding sheets are e-mailed. */
@Component({
  selector: 'gw-settings',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <div class="gw-page">
      <h1>Settings</h1>
      <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-labelledby="gw-shop-mail-title">
        <h2 id="gw-shop-mail-title">Winding shop e-mail</h2>
        <p>Each release sends the winding sheet (PDF attached) to this address.</p>
        <mat-form-field class="gw-email-field">
          <mat-label>Shop e-mail address</mat-label>
          <input matInput type="email" formControlName="shopEmail" autocomplete="email" required />
          @if (form.controls.shopEmail.hasError('server')) {
            <mat-error>{{ form.controls.shopEmail.getError('server') }}</mat-error>
          } @else if (form.controls.shopEmail.hasError('required')) {
            <mat-error>Enter the shop's e-mail address</mat-error>
          } @else if (form.controls.shopEmail.invalid) {
            <mat-error>Not a valid e-mail address</mat-error>
          }
        </mat-form-field>
        @if (formError()) {
          <p class="gw-form-error" role="alert">{{ formError() }}</p>
        }
        <div>
          <button mat-flat-button type="submit" [disabled]="busy()">Save</button>
        </div>
      </form>
    </div>
  `,
  styles: `
    .gw-email-field {
      width: min(100%, 420px);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Settings {
  private readonly api = inject(SettingsApi);
  private readonly notifier = inject(Notifier);

  protected readonly busy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly form = new FormGroup({
    shopEmail: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email, Validators.maxLength(200)] }),
  });

  constructor() {
    this.api.get().subscribe((settings) => this.form.reset(settings));
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.busy.set(true);
    this.formError.set(null);
    this.api.save({ shopEmail: this.form.controls.shopEmail.value.trim() }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.form.reset(saved);
        this.notifier.info(`Release mail now goes to ${saved.shopEmail}.`);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.formError.set(showServerFieldErrors(this.form, error));
      },
    });
  }
}
