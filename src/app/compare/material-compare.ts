import { PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, input, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MATERIAL_FAMILIES } from '@shared/engine/types';
import type { LossPoint } from '@shared/fitting/loss-points';
import { CURVE_LIMITS, type CompareCurvesResponse, type DesignFluxPoint } from '@shared/schemas/compare';
import { NgxEchartsDirective } from 'ngx-echarts';
import { catchError, forkJoin, map, of } from 'rxjs';

import { errorMessageOf } from '../core/api-error';
import { ChartThemes } from '../charts/chart-theme';
import { DesignsApi } from '../designs/designs-api';
import { LossPointsApi } from '../materials/loss-points-api';
import { QuantityPipe } from '../units/quantity';
import { QuantityInput } from '../units/quantity-input';
import { LoadState } from '../ui/load-state';
import { CompareApi, type MaterialChoice } from './compare-api';
import { DesignComparison } from './design-comparison';
import { designMark, type DesignMark } from './design-mark';
import { lossChartOptions, type LossMethod, type SweepAxis } from './loss-chart-options';
import { pointsInSlice, SLICE_RELATIVE_BAND, SLICE_TEMPERATURE_BAND, type ChartSlice } from './loss-point-slice';

/** Drawn first: every current material of the first family that has two or more, else the first three. */
export function defaultSelection(materials: readonly MaterialChoice[]): string[] {
  const family = MATERIAL_FAMILIES.find((f) => materials.filter((m) => m.family === f).length >= 2);
  const chosen = family ? materials.filter((m) => m.family === family) : materials.slice(0, 3);
  return chosen.slice(0, CURVE_LIMITS.materials).map((m) => m.id);
}

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
    PercentPipe,
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
  private readonly pointsApi = inject(LossPointsApi);
  private readonly designsApi = inject(DesignsApi);
  private readonly chartTheme = inject(ChartThemes).current;
  private readonly curvesHeading = viewChild.required<ElementRef<HTMLElement>>('curvesHeading');

  /** Query parameters `design` and `revision` open the page on that saved revision's comparison. */
  readonly design = input<string | undefined>();
  readonly revision = input<string | undefined>();

  protected readonly limits = CURVE_LIMITS;
  protected readonly band = { temperature: SLICE_TEMPERATURE_BAND, relative: SLICE_RELATIVE_BAND };
  protected readonly materials = this.api.materialsResource();
  /** The current materials by family, in the engine's family order, for the picker's groups. */
  protected readonly families = computed(() =>
    MATERIAL_FAMILIES.map((family) => ({ family, materials: this.materials.value().filter((m) => m.family === family) })).filter(
      (group) => group.materials.length,
    ),
  );
  protected readonly curveForm = new FormGroup({
    materialIds: new FormControl<string[]>([], {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(CURVE_LIMITS.materials)],
    }),
    /** Peak-to-peak flux swing (T) and frequency (Hz), SI as typed with units into the quantity fields. */
    deltaB: new FormControl<number | null>(0.2),
    frequency: new FormControl<number | null>(100e3),
    duty: new FormControl(0.5, { nonNullable: true, validators: [Validators.required, Validators.min(0.01), Validators.max(0.99)] }),
    /** Core temperature (°C): 100 °C, where ferrite loss data is commonly given (common practice, no source). */
    temperature: new FormControl(100, {
      nonNullable: true,
      validators: [Validators.required, Validators.min(CURVE_LIMITS.temperature.min), Validators.max(CURVE_LIMITS.temperature.max)],
    }),
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
  /** Loss points by material version id: a version's points never change, so each is fetched once. */
  private readonly measured = signal<ReadonlyMap<string, readonly LossPoint[]>>(new Map());

  /** The signed-in user's own saved designs, for marking one's operating point. */
  protected readonly myDesigns = toSignal(
    this.designsApi.list({ scope: 'mine', q: '', sort: 'updated', dir: 'desc', page: 0, pageSize: 100 }).pipe(
      map((r) => r.items),
      catchError(() => of([])),
    ),
    { initialValue: [] },
  );
  protected readonly markedDesign = signal<DesignMark | null>(null);
  protected readonly markNote = signal<string | null>(null);

  protected readonly slice = computed<ChartSlice | null>(() => {
    const c = this.curves();
    return c && c.temperature !== null ? { temperature: c.temperature, deltaB: c.deltaB, frequency: c.frequency } : null;
  });
  protected readonly frequencyChart = computed(() => this.chart('frequency'));
  protected readonly fluxChart = computed(() => this.chart('flux'));
  /** How many measured points each chart shows. */
  protected readonly shownPoints = computed(() => ({ frequency: this.pointCount('frequency'), flux: this.pointCount('flux') }));

  constructor() {
    effect(() => {
      const list = this.materials.value();
      const control = this.curveForm.controls.materialIds;
      if (list.length && !control.value.length) {
        control.setValue(defaultSelection(list));
        this.drawCurves();
      }
    });
  }

  private chart(axis: SweepAxis) {
    const c = this.curves();
    if (!c) return null;
    return lossChartOptions({
      materials: c.materials,
      axis,
      method: this.method(),
      theme: this.chartTheme(),
      measured: this.measured(),
      slice: this.slice(),
      design: this.markedDesign(),
    });
  }

  private pointCount(axis: SweepAxis): number {
    const slice = this.slice();
    const drawn = this.curves()?.materials ?? [];
    return slice ? drawn.reduce((n, m) => n + pointsInSlice(this.measured().get(m.id) ?? [], axis, slice).length, 0) : 0;
  }

  protected drawCurves(): void {
    if (this.curveForm.invalid) {
      this.curveForm.markAllAsTouched();
      return;
    }
    const { materialIds, deltaB, frequency, duty, temperature } = this.curveForm.getRawValue();
    this.curvesLoading.set(true);
    this.curvesError.set(null);
    this.api.curves({ materialIds, deltaB: deltaB!, frequency: frequency!, duty, temperature }).subscribe({
      next: (result) => {
        this.curvesLoading.set(false);
        this.curves.set(result);
        this.loadPoints(result.materials.map((m) => m.id));
      },
      error: (error: unknown) => {
        this.curvesLoading.set(false);
        this.curvesError.set(errorMessageOf(error));
      },
    });
  }

  /** The points of the drawn versions not fetched yet; one that fails is drawn without points and asked again next time. */
  private loadPoints(ids: readonly string[]): void {
    const missing = ids.filter((id) => !this.measured().has(id));
    if (!missing.length) return;
    forkJoin(
      missing.map((id) =>
        this.pointsApi.points(id).pipe(
          map((answer) => [id, answer.points] as const),
          catchError(() => of([id, null] as const)),
        ),
      ),
    ).subscribe((results) => {
      const next = new Map(this.measured());
      for (const [id, points] of results) if (points) next.set(id, points);
      this.measured.set(next);
    });
  }

  /** Marks the chosen design's operating point from its latest revision's saved result. */
  protected markDesign(id: number | null): void {
    this.markedDesign.set(null);
    this.markNote.set(null);
    if (id === null) return;
    this.designsApi.get(id).subscribe({
      next: (detail) => {
        const mark = designMark(detail);
        this.markedDesign.set(mark);
        if (!mark) this.markNote.set(`${detail.number} has no saved result yet: choose its core, material and wire on its design page.`);
      },
      error: (error: unknown) => this.markNote.set(errorMessageOf(error)),
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
