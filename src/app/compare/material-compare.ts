import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import type { CompareCurvesResponse, DesignComparisonRow } from '@shared/schemas/compare';
import { NgxEchartsDirective } from 'ngx-echarts';

import { errorMessageOf } from '../core/api-error';
import { showServerFieldErrors } from '../core/server-field-errors';
import { ThemeSwitcher } from '../core/theme-switcher';
import { CompareApi } from './compare-api';
import { lossChartOptions, type LossMethod } from './loss-chart-options';

const DEFAULT_SELECTION = 3;

@Component({
  selector: 'gw-material-compare',
  imports: [
    DecimalPipe,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
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
  private readonly sort = viewChild(MatSort);

  protected readonly materials = this.api.materialsResource();
  protected readonly cores = this.api.coresResource();
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

  protected readonly designForm = new FormGroup({
    vinMin: new FormControl(24, { nonNullable: true, validators: [Validators.required, Validators.min(0.5)] }),
    vinMax: new FormControl(36, { nonNullable: true, validators: [Validators.required, Validators.min(0.5)] }),
    vout: new FormControl(12, { nonNullable: true, validators: [Validators.required, Validators.min(0.1)] }),
    ioutMax: new FormControl(10, { nonNullable: true, validators: [Validators.required, Validators.min(0.001)] }),
    frequencyKilo: new FormControl(100, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(10000)] }),
    rippleRatio: new FormControl(0.3, { nonNullable: true, validators: [Validators.required, Validators.min(0.01), Validators.max(2)] }),
    coreId: new FormControl('ETD34/17/11', { nonNullable: true, validators: [Validators.required] }),
    turns: new FormControl(20, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(2000)] }),
    awg: new FormControl(18, { nonNullable: true, validators: [Validators.required, Validators.min(-3), Validators.max(46)] }),
    strands: new FormControl(2, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(5000)] }),
  });
  protected readonly designColumns = ['name', 'status', 'gap', 'coreLoss', 'copperLoss', 'totalLoss', 'temperatureRise', 'notes'];
  protected readonly designRows = new MatTableDataSource<DesignComparisonRow>([]);
  protected readonly designLoading = signal(false);
  protected readonly designError = signal<string | null>(null);
  protected readonly designShown = signal(false);

  constructor() {
    effect(() => {
      const list = this.materials.value();
      const control = this.curveForm.controls.materialIds;
      if (list.length && !control.value.length) {
        control.setValue(list.slice(0, DEFAULT_SELECTION).map((m) => m.id));
        this.drawCurves();
      }
    });
    effect(() => {
      const sort = this.sort();
      if (sort) this.designRows.sort = sort;
    });
    // Rows that could not be computed sort last whatever the direction.
    this.designRows.sortingDataAccessor = (row, column) => {
      const value = (row as unknown as Record<string, unknown>)[column];
      return typeof value === 'number' || typeof value === 'string' ? value : Number.MAX_VALUE;
    };
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

  protected compareDesign(): void {
    if (this.designForm.invalid) {
      this.designForm.markAllAsTouched();
      return;
    }
    const v = this.designForm.getRawValue();
    this.designLoading.set(true);
    this.designError.set(null);
    this.api
      .design({
        spec: { vinMin: v.vinMin, vinMax: v.vinMax, vout: v.vout, ioutMax: v.ioutMax, frequency: v.frequencyKilo * 1000, rippleRatio: v.rippleRatio },
        coreId: v.coreId,
        turns: v.turns,
        wire: { kind: 'awg', awg: v.awg, strands: v.strands },
      })
      .subscribe({
        next: (result) => {
          this.designLoading.set(false);
          this.designShown.set(true);
          this.designRows.data = result.rows;
        },
        error: (error: unknown) => {
          this.designLoading.set(false);
          this.designError.set(showServerFieldErrors(this.designForm, error) ?? 'Some fields need attention; see the messages under them.');
        },
      });
  }
}
