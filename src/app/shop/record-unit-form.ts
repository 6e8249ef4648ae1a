import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { recordUnit } from '@shared/api/shop';
import type { RecordedUnit, UnitMeasurementRequest } from '@shared/schemas/shop';
import { CONDITION_TOLERANCE, testFrequencyMatches } from '@shared/shop/measurement';
import type { SheetTestLimits } from '@shared/shop/sheet';
import { formatQuantity } from '@shared/units/format';

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
        @if (bias(); as b) {
          <gw-quantity-input
            label="L under DC bias"
            kind="inductance"
            formControlName="biasInductance"
            placeholder="e.g. 20 uH"
            [hint]="'At least ' + format(b.min, 'inductance') + ' at ' + format(b.current, 'current')"
          />
          <gw-quantity-input label="DC bias current" kind="current" formControlName="biasCurrent" placeholder="e.g. 11 A" />
        }
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
      @if (unitNumber() !== null) {
        <p role="status">Recording unit {{ unitNumber() }} again (its earlier record is voided).</p>
      }
      @if (warnings().length) {
        <div class="gw-unit-warning" role="alert">
          <p>Check before saving: this unit will not be judged against the sheet as measured.</p>
          <ul>
            @for (warning of warnings(); track warning) {
              <li>{{ warning }}</li>
            }
          </ul>
          @if (confirming()) {
            <p>Correct the reading, or record it anyway: it will be saved as failed.</p>
          }
        </div>
      }
      @if (formError()) {
        <p class="gw-form-error" role="alert">{{ formError() }}</p>
      }
      <button mat-flat-button type="submit" [disabled]="busy()">{{ confirming() ? 'Record anyway' : 'Record unit' }}</button>
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
    .gw-unit-warning {
      border-left: 4px solid var(--mat-sys-error);
      padding: 4px 12px;
      margin-bottom: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordUnitForm {
  private readonly api = inject(Api);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  readonly orderId = input.required<number>();
  /** The sheet's limits: its test frequency is filled in, and a reading under other conditions is warned of before saving. */
  readonly limits = input<SheetTestLimits | null>(null);
  /** A voided unit number to record again; null for the next unit. */
  readonly unitNumber = input<number | null>(null);
  readonly recorded = output<RecordedUnit>();

  protected readonly busy = signal(false);
  protected readonly formError = signal<string | null>(null);
  /** A save was asked for with warnings showing: the next one saves. */
  protected readonly confirming = signal(false);
  protected readonly bias = computed(() => this.limits()?.biasInductance ?? null);
  protected readonly format = formatQuantity;

  protected readonly form = new FormGroup({
    inductance: new FormControl<number | null>(null),
    testFrequency: new FormControl<number | null>(null),
    resistance: new FormControl<number | null>(null),
    resistanceTemperature: new FormControl<number | null>(20),
    hipot: new FormControl<Hipot | null>(null, { validators: [Validators.required] }),
    notes: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    biasInductance: new FormControl<number | null>(null),
    biasCurrent: new FormControl<number | null>(null),
  });
  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.value });

  /** What differs from the sheet's test conditions, in words; the server judges the unit the same way. */
  protected readonly warnings = computed(() => {
    const limits = this.limits();
    const v = this.values();
    if (!limits) return [];
    const out: string[] = [];
    const specified = limits.inductance.testFrequency;
    if (typeof v.testFrequency === 'number' && !testFrequencyMatches(v.testFrequency, specified))
      out.push(
        `Measured at ${formatQuantity(v.testFrequency, 'frequency')}; the sheet specifies ${formatQuantity(specified, 'frequency')}: ` +
          'the inductance limits hold only there, so this unit will fail.',
      );
    const bias = limits.biasInductance;
    if (bias) {
      if (v.biasInductance == null || v.biasCurrent == null)
        out.push(`The sheet asks for L under DC bias at ${formatQuantity(bias.current, 'current')}; without it this unit will fail.`);
      else if (v.biasCurrent < (1 - CONDITION_TOLERANCE) * bias.current)
        out.push(
          `L under bias read at ${formatQuantity(v.biasCurrent, 'current')}; the sheet asks for ${formatQuantity(bias.current, 'current')}.`,
        );
    }
    return out;
  });

  constructor() {
    effect(() => {
      const limits = this.limits();
      if (!limits) return;
      const { testFrequency, biasCurrent } = this.form.controls;
      if (testFrequency.pristine) testFrequency.setValue(limits.inductance.testFrequency);
      if (limits.biasInductance && biasCurrent.pristine) biasCurrent.setValue(limits.biasInductance.current);
    });
    // A changed reading is warned of afresh.
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.confirming.set(false));
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    if (this.warnings().length && !this.confirming()) {
      this.confirming.set(true);
      return;
    }
    this.confirming.set(false);
    const v = this.form.getRawValue();
    const again = this.unitNumber();
    const notes = v.notes.trim();
    const measurement: UnitMeasurementRequest = {
      inductance: v.inductance!,
      testFrequency: v.testFrequency!,
      resistance: v.resistance!,
      resistanceTemperature: v.resistanceTemperature!,
      hipot: v.hipot!,
      ...(notes ? { notes } : {}),
      ...(v.biasInductance != null && v.biasCurrent != null ? { biasInductance: v.biasInductance, biasCurrent: v.biasCurrent } : {}),
      ...(again !== null ? { unitNumber: again } : {}),
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
          biasCurrent: v.biasCurrent,
          hipot: null,
          notes: '',
        });
        this.confirming.set(false);
        this.recorded.emit(recorded);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.formError.set(showServerFieldErrors(this.form, error));
      },
    });
  }
}
