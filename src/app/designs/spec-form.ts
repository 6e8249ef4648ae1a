import { ChangeDetectionStrategy, Component, effect, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { CORE_FAMILIES } from '@shared/engine/types';

import { QuantityInput } from '../units/quantity-input';
import type { MaterialView } from './designs-api';
import type { SpecForm } from './spec-model';

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
  protected readonly rippleMode = signal<'ratio' | 'current' | 'inductance'>('ratio');
  protected readonly rectifier = signal<'synchronous' | 'diode'>('synchronous');

  constructor() {
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
