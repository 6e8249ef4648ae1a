import { ChangeDetectionStrategy, Component, computed, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { VOLUME_CONSISTENCY_TOLERANCE } from '@shared/catalogue/core-schema';
import { GAPPED_CORE_FAMILIES } from '@shared/schemas/cores';
import { fromDisplay, toDisplay, type DisplayUnit } from '@shared/units/index';

import { CoreNameField } from './core-name-field';
import type { CatalogueCore } from './cores-api';
import { UserCoreForm } from './user-core-form';

type GappedFamily = (typeof GAPPED_CORE_FAMILIES)[number];
type ParameterName = 'ae' | 'amin' | 'le' | 've' | 'windowArea' | 'windowHeight' | 'bobbinWidth' | 'bobbinHeight' | 'mlt' | 'surfaceArea';

/** Each effective parameter as typed (unit in the label), in a display unit of the shared unit layer. */
const PARAMETERS: readonly { name: ParameterName; label: string; unit: DisplayUnit; required: boolean }[] = [
  { name: 'ae', label: 'Ae, effective area (mm²)', unit: 'mm²', required: true },
  { name: 'amin', label: 'Amin, optional (mm²)', unit: 'mm²', required: false },
  { name: 'le', label: 'le, effective path length (mm)', unit: 'mm', required: true },
  { name: 've', label: 'Ve, effective volume (mm³)', unit: 'mm³', required: true },
  { name: 'windowArea', label: 'Window area (mm²)', unit: 'mm²', required: true },
  { name: 'windowHeight', label: 'Window height (mm)', unit: 'mm', required: true },
  { name: 'bobbinWidth', label: 'Bobbin winding width (mm)', unit: 'mm', required: true },
  { name: 'bobbinHeight', label: 'Bobbin winding height (mm)', unit: 'mm', required: true },
  { name: 'mlt', label: 'Mean length of a turn (mm)', unit: 'mm', required: true },
  { name: 'surfaceArea', label: 'Outer surface for cooling (cm²)', unit: 'cm²', required: true },
];

const parameterControl = (required: boolean) =>
  new FormControl<number | null>(null, { validators: required ? [Validators.required, Validators.min(1e-3)] : [Validators.min(1e-3)] });

/** A gapped set (E, ETD, PQ, RM, pot…) from its effective parameters as a datasheet or a drawing gives them. */
@Component({
  selector: 'gw-shaped-core-form',
  imports: [CoreNameField, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './shaped-core-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShapedCoreForm extends UserCoreForm {
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected readonly families = GAPPED_CORE_FAMILIES;
  protected readonly parameters = PARAMETERS;
  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(60), Validators.pattern(/^[^=+\-@]/)],
    }),
    family: new FormControl<GappedFamily>('ETD', { nonNullable: true, validators: [Validators.required] }),
    ae: parameterControl(true),
    amin: parameterControl(false),
    le: parameterControl(true),
    ve: parameterControl(true),
    windowArea: parameterControl(true),
    windowHeight: parameterControl(true),
    bobbinWidth: parameterControl(true),
    bobbinHeight: parameterControl(true),
    mlt: parameterControl(true),
    surfaceArea: parameterControl(true),
    source: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(300)] }),
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.value });
  /** Ae·le beside the volume field: the server refuses a Ve more than 5 % away from it. */
  protected readonly volumeHint = computed(() => {
    const { ae, le } = this.values();
    return ae && le ? `Ae·le = ${(ae * le).toPrecision(4)} mm³; Ve must be within ${VOLUME_CONSISTENCY_TOLERANCE * 100} %` : '';
  });

  protected fill(core: CatalogueCore): void {
    const shown = (p: (typeof PARAMETERS)[number]) => {
      const si = core[p.name];
      return si === undefined ? null : Number(toDisplay(si, p.unit).toPrecision(10));
    };
    this.form.reset({
      name: core.id,
      family: (GAPPED_CORE_FAMILIES as readonly string[]).includes(core.family) ? (core.family as GappedFamily) : 'ETD',
      ...Object.fromEntries(PARAMETERS.map((p) => [p.name, shown(p)])),
      source: core.source,
    });
  }

  protected clear(): void {
    this.formDirective().resetForm({ name: '', family: 'ETD', source: '' });
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const si = Object.fromEntries(
      PARAMETERS.filter((p) => v[p.name] !== null).map((p) => [p.name, fromDisplay(v[p.name] as number, p.unit)]),
    ) as Record<ParameterName, number>;
    this.send({ kind: 'shape', name: v.name.trim(), family: v.family, ...si, source: v.source.trim() });
  }
}
