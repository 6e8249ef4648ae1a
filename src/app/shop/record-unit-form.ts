import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { recordUnit } from '@shared/api/shop';
import type { RecordedUnit, UnitMeasurementRequest } from '@shared/schemas/shop';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { showServerFieldErrors } from '../core/server-field-errors';
import { QuantityInput } from '../units/quantity-input';

type Hipot = UnitMeasurementRequest['hipot'];

/** One built unit's measurements; values are typed with units ("98 uH", "100 kHz", "41 mOhm", "23 °C"). */
@Component({
  selector: 'gw-record-unit-form',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, QuantityInput, ReactiveFormsModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-label="Record a built unit">
      <div class="gw-unit-grid">
        <gw-quantity-input
          label="Measured inductance"
          kind="inductance"
          formControlName="inductance"
          [required]="true"
          placeholder="e.g. 33 uH"
        />
        <gw-quantity-input
          label="Test frequency"
          kind="frequency"
          formControlName="testFrequency"
          [required]="true"
          placeholder="e.g. 10 kHz"
        />
        <gw-quantity-input
          label="DC resistance"
          kind="resistance"
          formControlName="resistance"
          [required]="true"
          placeholder="e.g. 12 mOhm"
        />
        <gw-quantity-input
          label="Temperature at the DCR reading"
          kind="temperature"
          formControlName="resistanceTemperature"
          [required]="true"
          placeholder="e.g. 23 °C"
          hint="Corrected to 20 °C for the check"
        />
        <mat-form-field>
          <mat-label>Hipot</mat-label>
          <mat-select formControlName="hipot" required>
            <mat-option value="pass">Pass</mat-option>
            <mat-option value="fail">Fail</mat-option>
            <mat-option value="not_tested">Not tested</mat-option>
          </mat-select>
          @if (form.controls.hipot.hasError('server')) {
            <mat-error>{{ form.controls.hipot.getError('server') }}</mat-error>
          } @else if (form.controls.hipot.invalid) {
            <mat-error>Choose pass, fail or not tested</mat-error>
          }
        </mat-form-field>
      </div>
      <mat-form-field class="gw-unit-notes">
        <mat-label>Notes (optional)</mat-label>
        <textarea matInput rows="2" formControlName="notes"></textarea>
        @if (form.controls.notes.hasError('server')) {
          <mat-error>{{ form.controls.notes.getError('server') }}</mat-error>
        } @else if (form.controls.notes.hasError('maxlength')) {
          <mat-error>At most 2000 characters</mat-error>
        }
      </mat-form-field>
      @if (formError()) {
        <p class="gw-form-error" role="alert">{{ formError() }}</p>
      }
      <button mat-flat-button type="submit" [disabled]="busy()">Record unit</button>
    </form>
  `,
  styles: `
    .gw-unit-grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
      gap: 8px 16px;
    }
    .gw-unit-notes {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordUnitForm {
  private readonly api = inject(Api);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  readonly orderId = input.required<number>();
  /** The sheet's test frequency (Hz), filled in so the winder only changes it when the meter differs. */
  readonly testFrequency = input<number | null>(null);
  readonly recorded = output<RecordedUnit>();

  protected readonly busy = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected readonly form = new FormGroup({
    inductance: new FormControl<number | null>(null),
    testFrequency: new FormControl<number | null>(null),
    resistance: new FormControl<number | null>(null),
    resistanceTemperature: new FormControl<number | null>(20),
    hipot: new FormControl<Hipot | null>(null, { validators: [Validators.required] }),
    notes: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
  });

  constructor() {
    effect(() => {
      const frequency = this.testFrequency();
      if (frequency !== null && this.form.controls.testFrequency.pristine) this.form.controls.testFrequency.setValue(frequency);
    });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    const notes = v.notes.trim();
    const measurement: UnitMeasurementRequest = {
      inductance: v.inductance!,
      testFrequency: v.testFrequency!,
      resistance: v.resistance!,
      resistanceTemperature: v.resistanceTemperature!,
      hipot: v.hipot!,
      ...(notes ? { notes } : {}),
    };
    this.busy.set(true);
    this.formError.set(null);
    // Failures come back here and are shown under the fields they name.
    this.api.call(recordUnit, { params: { id: String(this.orderId()) }, body: measurement }, errorsShownByCaller()).subscribe({
      next: (recorded) => {
        this.busy.set(false);
        const frequency = v.testFrequency;
        // resetForm also clears the submitted state, so the emptied fields do not show errors.
        this.formDirective().resetForm({
          resistanceTemperature: v.resistanceTemperature,
          testFrequency: frequency,
          hipot: null,
          notes: '',
        });
        this.recorded.emit(recorded);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.formError.set(showServerFieldErrors(this.form, error));
      },
    });
  }
}
