import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, input, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { CURVE_LIMITS, type CompareCurvesResponse, type DesignFluxPoint } from '@shared/schemas/compare';
import { NgxEchartsDirective } from 'ngx-echarts';

import { errorMessageOf } from '../core/api-error';
import { ThemeSwitcher } from '../core/theme-switcher';
import { QuantityPipe } from '../units/quantity';
import { QuantityInput } from '../units/quantity-input';
import { LoadState } from '../ui/load-state';
import { CompareApi } from './compare-api';
import { DesignComparison } from './design-comparison';
import { lossChartOptions, type LossMethod } from './loss-chart-options';

const DEFAULT_SELECTION = 3;

@Component({
  selector: 'gw-material-compare',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    DesignComparison,
    MatFormFieldModule,
    MatInputModule,
    LoadState,
    MatSelectModule,
    NgxEchartsDirective,
    QuantityInput,
    QuantityPipe,
    ReactiveFormsModule,
  ],
  templateUrl: './material-compare.html',
  styleUrl: './material-compare.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialCompare {
  private readonly api = inject(CompareApi);
  private readonly theme = inject(ThemeSwitcher);
  private readonly curvesHeading = viewChild.required<ElementRef<HTMLElement>>('curvesHeading');

  /** Query parameters `design` and `revision` open the page on that saved revision's comparison. */
  readonly design = input<string | undefined>();
  readonly revision = input<string | undefined>();

  protected readonly materials = this.api.materialsResource();
  protected readonly curveForm = new FormGroup({
    materialIds: new FormControl<string[]>([], { nonNullable: true, validators: [Validators.required] }),
    /** Peak-to-peak flux swing (T) and frequency (Hz), SI as typed with units into the quantity fields. */
    deltaB: new FormControl<number | null>(0.2),
    frequency: new FormControl<number | null>(100e3),
    duty: new FormControl(0.5, { nonNullable: true, validators: [Validators.required, Validators.min(0.01), Validators.max(0.99)] }),
  });
  protected readonly curveFields = [
    {
      name: 'deltaB',
      label: 'ΔB for the frequency sweep, peak to peak',
      kind: 'fluxDensity',
      limits: CURVE_LIMITS.deltaB,
      placeholder: 'e.g. 200 mT',
    },
    {
      name: 'frequency',
      label: 'Frequency for the ΔB sweep',
      kind: 'frequency',
      limits: CURVE_LIMITS.frequency,
      placeholder: 'e.g. 100 kHz',
    },
  ] as const;
  protected readonly method = signal<LossMethod>('igse');
  protected readonly curves = signal<CompareCurvesResponse | null>(null);
  protected readonly curvesLoading = signal(false);
  protected readonly curvesError = signal<string | null>(null);
  private readonly dark = computed(() => this.theme.theme() === 'dark');
  protected readonly frequencyChart = computed(() => {
    const c = this.curves();
    return c ? lossChartOptions(c.materials, 'frequency', this.method(), this.dark()) : null;
  });
  protected readonly fluxChart = computed(() => {
    const c = this.curves();
    return c ? lossChartOptions(c.materials, 'flux', this.method(), this.dark()) : null;
  });

  constructor() {
    effect(() => {
      const list = this.materials.value();
      const control = this.curveForm.controls.materialIds;
      if (list.length && !control.value.length) {
        control.setValue(list.slice(0, DEFAULT_SELECTION).map((m) => m.id));
        this.drawCurves();
      }
    });
  }

  protected drawCurves(): void {
    if (this.curveForm.invalid) {
      this.curveForm.markAllAsTouched();
      return;
    }
    const { materialIds, deltaB, frequency, duty } = this.curveForm.getRawValue();
    this.curvesLoading.set(true);
    this.curvesError.set(null);
    this.api.curves({ materialIds, deltaB: deltaB!, frequency: frequency!, duty }).subscribe({
      next: (result) => {
        this.curvesLoading.set(false);
        this.curves.set(result);
      },
      error: (error: unknown) => {
        this.curvesLoading.set(false);
        this.curvesError.set(errorMessageOf(error));
      },
    });
  }

  /** The curves at a compared design's flux swing, frequency and duty; focus moves up to them. */
  protected drawAt(point: DesignFluxPoint): void {
    this.curveForm.patchValue({
      deltaB: Number(point.deltaB.toPrecision(4)),
      frequency: Number(point.frequency.toPrecision(6)),
      duty: Number(point.duty.toPrecision(3)),
    });
    this.drawCurves();
    const heading = this.curvesHeading().nativeElement;
    heading.scrollIntoView?.({ block: 'start' });
    heading.focus();
  }
}
