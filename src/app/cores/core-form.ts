import { ChangeDetectionStrategy, Component, inject, output, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { showServerFieldErrors } from '../core/server-field-errors';
import { CoreNameField } from './core-name-field';
import { CoresApi, type CatalogueCore } from './cores-api';

const MM = 1e-3;

/** A ring core from its nominal dimensions; the server computes le, Ae and Ve by IEC 60205. */
@Component({
  selector: 'gw-core-form',
  imports: [CoreNameField, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './core-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreForm {
  private readonly api = inject(CoresApi);
  private readonly formDirective = viewChild.required(FormGroupDirective);
  readonly created = output<CatalogueCore>();

  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(60), Validators.pattern(/^[^=+\-@]/)] }),
    family: new FormControl<'RING' | 'POWDER_TOROID'>('POWDER_TOROID', { nonNullable: true, validators: [Validators.required] }),
    outerDiameter: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.5), Validators.max(500)] }),
    innerDiameter: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.2), Validators.max(500)] }),
    height: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.2), Validators.max(500)] }),
    source: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(300)] }),
  });
  protected readonly submitting = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected submit(): void {
    const v = this.form.getRawValue();
    if (v.outerDiameter !== null && v.innerDiameter !== null && v.innerDiameter >= v.outerDiameter) {
      this.form.controls.innerDiameter.setErrors({ smaller: true });
    }
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.failure.set(null);
    this.api
      .create({
        kind: 'ring',
        name: v.name.trim(),
        family: v.family,
        outerDiameter: v.outerDiameter! * MM,
        innerDiameter: v.innerDiameter! * MM,
        height: v.height! * MM,
        source: v.source.trim(),
      })
      .subscribe({
        next: (core) => {
          this.submitting.set(false);
          this.formDirective().resetForm({ family: 'POWDER_TOROID', source: '', name: '' });
          this.created.emit(core);
        },
        error: (error: unknown) => {
          this.submitting.set(false);
          this.failure.set(showServerFieldErrors(this.form, error));
        },
      });
  }
}
