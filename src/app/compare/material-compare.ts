import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, input, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { CompareCurvesResponse, DesignFluxPoint } from '@shared/schemas/compare';
import { NgxEchartsDirective } from 'ngx-echarts';

import { errorMessageOf } from '../core/api-error';
import { ThemeSwitcher } from '../core/theme-switcher';
import { CompareApi } from './compare-api';
import { DesignComparison } from './design-comparison';
import { lossChartOptions, type LossMethod } from './loss-chart-options';

const DEFAULT_SELECTION = 3;

@Component({
  selector: 'gw-material-compare',
  imports: [
    DecimalPipe,
    MatButtonModule,
    MatButtonToggleModule,
    DesignComparison,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    NgxEchartsDirective,
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
    deltaBMilli: new FormControl(200, { nonNullable: true, validators: [Validators.required, Validators.min(0.1), Validators.max(2000)] }),
    frequencyKilo: new FormControl(100, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(10000)] }),
    duty: new FormControl(0.5, { nonNullable: true, validators: [Validators.required, Validators.min(0.01), Validators.max(0.99)] }),
  });
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
    const { materialIds, deltaBMilli, frequencyKilo, duty } = this.curveForm.getRawValue();
    this.curvesLoading.set(true);
    this.curvesError.set(null);
    this.api.curves({ materialIds, deltaB: deltaBMilli / 1000, frequency: frequencyKilo * 1000, duty }).subscribe({
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
      deltaBMilli: Number((point.deltaB * 1000).toPrecision(4)),
      frequencyKilo: Number((point.frequency / 1000).toPrecision(6)),
      duty: Number(point.duty.toPrecision(3)),
    });
    this.drawCurves();
    const heading = this.curvesHeading().nativeElement;
    heading.scrollIntoView?.({ block: 'start' });
    heading.focus();
  }
}
