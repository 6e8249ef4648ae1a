import { ChangeDetectionStrategy, Component, computed, effect, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { CORE_FAMILIES } from '@shared/engine/types';
import { formatQuantity } from '@shared/units/index';

import { SPEC_FIELD_RANGES } from '@shared/schemas/field-ranges';
import { QuantityInput } from '../units/quantity-input';
import type { MaterialView } from './designs-api';
import type { SpecForm, SpecFormValue } from './spec-model';

/** The converter spec: every number typed with units; limits start at the engine's defaults, shown in the fields. */
@Component({
  selector: 'gw-spec-form',
  imports: [ReactiveFormsModule, QuantityInput, MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './spec-form.html',
  styleUrl: './spec-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpecFormComponent {
  readonly form = input.required<SpecForm>();
  readonly materials = input<MaterialView[]>([]);

  protected readonly families = CORE_FAMILIES;
  /** Each number field's allowed range, from the schemas the server validates with; shown at the field in its units. */
  protected readonly ranges = SPEC_FIELD_RANGES;
  protected readonly rippleMode = signal<'ratio' | 'current' | 'inductance'>('ratio');
  protected readonly rectifier = signal<'synchronous' | 'diode'>('synchronous');
  private readonly values = signal<SpecFormValue | null>(null);

  /** Vout at or above Vin min: a buck cannot make it (the server refuses it too, naming vout). */
  protected readonly voutWarning = computed(() => {
    const v = this.values();
    if (!v || v.vout === null || v.vinMin === null || v.vout < v.vinMin) return '';
    return `At or above Vin min (${formatQuantity(v.vinMin, 'voltage')}): a buck converter needs Vout below its lowest input`;
  });

  /** A current limit below the full-load peak: the controller would limit before full load. */
  protected readonly currentLimitWarning = computed(() => {
    const v = this.values();
    if (!v || v.currentLimit === null || v.ioutMax === null) return '';
    const ripple =
      v.rippleMode === 'ratio' && v.rippleRatio !== null ? v.rippleRatio * v.ioutMax : v.rippleMode === 'current' ? v.rippleCurrent : null;
    if (ripple === null) return '';
    const peak = v.ioutMax + ripple / 2;
    if (v.currentLimit >= peak) return '';
    return `Below the full-load peak inductor current of ${formatQuantity(peak, 'current')}: the controller would limit before full load`;
  });

  constructor() {
    effect((onCleanup) => {
      const form = this.form();
      this.values.set(form.getRawValue());
      const all = form.valueChanges.subscribe(() => this.values.set(form.getRawValue()));
      onCleanup(() => all.unsubscribe());
    });
    effect((onCleanup) => {
      const form = this.form();
      this.rippleMode.set(form.controls.rippleMode.value);
      this.rectifier.set(form.controls.rectifier.value);
      const a = form.controls.rippleMode.valueChanges.subscribe((mode) => this.rippleMode.set(mode));
      const b = form.controls.rectifier.valueChanges.subscribe((kind) => this.rectifier.set(kind));
      onCleanup(() => {
        a.unsubscribe();
        b.unsubscribe();
      });
    });
  }

  protected familyLabel(family: string): string {
    return family === 'POWDER_TOROID' ? 'Powder toroid' : family === 'RING' ? 'Ring (ferrite)' : family === 'POT' ? 'Pot' : family;
  }
}
