import { ChangeDetectionStrategy, Component, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { IEC60205_SOURCE_NOTE } from '@shared/catalogue/core-schema';
import { fromDisplay, toDisplay } from '@shared/units/index';

import { CoreNameField } from './core-name-field';
import type { CatalogueCore } from './cores-api';
import { UserCoreForm } from './user-core-form';

/** A ring core from its nominal dimensions (new, or a new version of one); the server computes le, Ae and Ve by IEC 60205. */
@Component({
  selector: 'gw-core-form',
  imports: [CoreNameField, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './core-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreForm extends UserCoreForm {
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(60), Validators.pattern(/^[^=+\-@]/)],
    }),
    family: new FormControl<'RING' | 'POWDER_TOROID'>('POWDER_TOROID', { nonNullable: true, validators: [Validators.required] }),
    outerDiameter: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.5), Validators.max(500)] }),
    innerDiameter: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.2), Validators.max(500)] }),
    height: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(0.2), Validators.max(500)] }),
    source: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(300)] }),
  });

  protected fill(core: CatalogueCore): void {
    const ring = core.ring!;
    this.form.reset({
      name: core.id,
      family: core.family === 'RING' ? 'RING' : 'POWDER_TOROID',
      outerDiameter: toDisplay(ring.od, 'mm'),
      innerDiameter: toDisplay(ring.id, 'mm'),
      height: toDisplay(ring.height, 'mm'),
      // The server puts the IEC 60205 note in front of what was typed; the form shows only the typed part.
      source: core.source.replace(IEC60205_SOURCE_NOTE, '').replace(/^;\s*/, ''),
    });
  }

  protected clear(): void {
    this.formDirective().resetForm({ family: 'POWDER_TOROID', source: '', name: '' });
  }

  protected submit(): void {
    const v = this.form.getRawValue();
    if (v.outerDiameter !== null && v.innerDiameter !== null && v.innerDiameter >= v.outerDiameter) {
      this.form.controls.innerDiameter.setErrors({ smaller: true });
    }
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.send({
      kind: 'ring',
      name: v.name.trim(),
      family: v.family,
      outerDiameter: fromDisplay(v.outerDiameter!, 'mm'),
      innerDiameter: fromDisplay(v.innerDiameter!, 'mm'),
      height: fromDisplay(v.height!, 'mm'),
      source: v.source.trim(),
    });
  }
}
