import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { THERMAL_MODEL_LIMIT } from '@shared/engine/thermal';
import { gapInputOf, type GapPlacement } from '@shared/engine/types';
import type { Construction, DesignSpec } from '@shared/schemas/designs';
import type { EvaluateAnswer } from '@shared/schemas/calc-answers';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import { Subject, catchError, debounceTime, map, of, switchMap, tap } from 'rxjs';

import { CautionLine } from '../caution-line/caution-line';
import { ChartThemes, themed } from '../charts/chart-theme';
import { errorMessageOf } from '../core/api-error';
import { QuantityPipe } from '../units/quantity';
import { QuantityInput } from '../units/quantity-input';
import { CoresApi } from '../cores/cores-api';
import { LoadState } from '../ui/load-state';
import { DesignsApi, type MaterialView } from './designs-api';
import { CornerTable } from './corner-table';
import { frequencyChartLabel, frequencyChartOptions } from './frequency-chart-options';
import { loadMapChartLabel, loadMapChartOptions } from './load-map-chart-options';
import { percent, show, showUnit } from './format';
import { WindingDrawingView } from '../shop/winding-drawing-view';
import { windingDrawingInput } from '@shared/shop/winding-drawing';

type WireKind = 'awg' | 'metric' | 'litz' | 'foil';

/** The loss the gap's fringing field drives in the winding, in the figures and the loss chart's description. */
export const GAP_LOSS_WORDS = "Winding loss from the gap's field";

/** The chosen design: every figure, three charts, warnings; core, material, turns, gap placement, gap and wire re-evaluate live. */
@Component({
  selector: 'gw-design-panel',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    LoadState,
    MatSelectModule,
    NgxEchartsDirective,
    QuantityInput,
    QuantityPipe,
    CautionLine,
    CornerTable,
    WindingDrawingView,
  ],
  templateUrl: './design-panel.html',
  styleUrl: './design-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignPanel {
  private readonly api = inject(DesignsApi);
  private readonly chartTheme = inject(ChartThemes).current;
  protected readonly cores = inject(CoresApi).listResource();
  readonly spec = input<DesignSpec | null>(null);
  readonly construction = input<Construction | null>(null);
  /** Figures already computed for that construction (a picked candidate or the saved snapshot). */
  readonly known = input<EvaluateAnswer | null>(null);
  readonly materials = input<MaterialView[]>([]);
  readonly editable = input(true);
  readonly changed = output<{ construction: Construction; view: EvaluateAnswer }>();

  protected readonly form = new FormGroup({
    coreId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    materialId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    turns: new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(1), Validators.max(2000)] }),
    placement: new FormControl<GapPlacement>('ground', { nonNullable: true }),
    gap: new FormControl<number | null>(null),
    /** Copper's clearance from the centre leg and its gap (m); empty follows the limits' keep-out. */
    keepOut: new FormControl<number | null>(null, { validators: [Validators.min(0), Validators.max(10e-3)] }),
    wireKind: new FormControl<WireKind>('awg', { nonNullable: true }),
    awg: new FormControl<number | null>(null, { validators: [Validators.min(-3), Validators.max(46)] }),
    strandDiameter: new FormControl<number | null>(null),
    strands: new FormControl<number | null>(1, { validators: [Validators.required, Validators.min(1), Validators.max(5000)] }),
  });
  protected readonly wireKind = signal<WireKind>('awg');
  protected readonly placement = signal<GapPlacement>('ground');
  protected readonly view = signal<EvaluateAnswer | null>(null);
  protected readonly evaluating = signal(false);
  protected readonly error = signal<string | null>(null);
  private readonly edits = new Subject<void>();
  private silent = false;
  /** Another core was chosen: turns and gap of the old core mean nothing there, so the engine solves them again. */
  private coreChanged = false;
  /** The other placement was chosen: a ground gap is no spacer thickness, so the engine solves the gap again. */
  private placementChanged = false;

  protected readonly fmt = show;
  protected readonly unit = showUnit;
  protected readonly pct = percent;
  protected readonly gapLossWords = GAP_LOSS_WORDS;
  protected readonly result = computed(() => this.view()?.result ?? null);
  /** What the winding drawing is drawn from: the result, its wire and its core's shape (once the cores are listed). */
  protected readonly drawingSource = computed(() => {
    const view = this.view();
    const core = view && this.cores.value().find((c) => c.id === view.result.core.id);
    return view && core ? windingDrawingInput(view.result, core, view.wire) : null;
  });
  /** Cores that take the current material: gapped sets for ferrites and the like, rings and toroids for powders. */
  protected readonly coreOptions = computed(() => {
    const powder = this.result()?.material.family === 'powder';
    const current = this.result()?.core.id;
    return this.cores.value().filter((c) => c.id === current || (!c.retired && (c.gapKind === 'distributed') === powder));
  });
  /**
   * Current materials of the right kind, plus the version this design was built with when it is no longer current
   * (edited or retired since): without it the field would show nothing.
   */
  protected readonly materialOptions = computed((): { id: string; name: string }[] => {
    const own = this.result()?.material;
    const options = this.materials().filter((m) => !own || (m.family === 'powder') === (own.family === 'powder'));
    if (!own || options.some((m) => m.id === own.id)) return options;
    return [{ id: own.id, name: `${own.name} (the version this design uses; since replaced)` }, ...options];
  });

  constructor() {
    effect(() => {
      const construction = this.construction();
      const known = this.known();
      untracked(() => this.load(construction, known));
    });
    effect(() => {
      const editable = this.editable();
      untracked(() => (editable ? this.form.enable({ emitEvent: false }) : this.form.disable({ emitEvent: false })));
    });
    this.form.controls.wireKind.valueChanges.pipe(takeUntilDestroyed()).subscribe((kind) => this.wireKind.set(kind));
    this.form.controls.coreId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      if (!this.silent) this.coreChanged = true;
    });
    this.form.controls.placement.valueChanges.pipe(takeUntilDestroyed()).subscribe((placement) => {
      this.placement.set(placement);
      if (!this.silent) this.placementChanged = true;
    });
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      if (!this.silent) this.edits.next();
    });
    this.edits
      .pipe(
        debounceTime(300),
        map(() => this.constructionFromForm()),
        switchMap((construction) => {
          const spec = this.spec();
          if (!construction || !spec) return of(null);
          this.evaluating.set(true);
          return this.api.evaluate(spec, construction).pipe(
            map((view) => ({ construction, view })),
            catchError((error: unknown) => {
              this.error.set(errorMessageOf(error));
              return of(null);
            }),
          );
        }),
        tap(() => this.evaluating.set(false)),
        takeUntilDestroyed(),
      )
      .subscribe((outcome) => {
        if (!outcome) return;
        this.error.set(null);
        this.view.set(outcome.view);
        const r = outcome.view.result;
        if (outcome.construction.turns === 'auto' || outcome.construction.gap === 'auto') {
          // The engine chose turns or gap (new core, other placement); the fields show them so the next edit starts there.
          this.silent = true;
          this.form.patchValue({ turns: r.turns, gap: gapInputOf(r.gap) });
          this.silent = false;
        }
        this.changed.emit({
          construction: { ...outcome.construction, turns: r.turns, gap: gapInputOf(r.gap), placement: r.gap.placement },
          view: outcome.view,
        });
      });
  }

  /** Re-evaluates with the current spec (the workspace calls this when the spec changes). */
  reevaluate(): void {
    this.edits.next();
  }

  private load(construction: Construction | null, known: EvaluateAnswer | null): void {
    if (!construction) {
      this.view.set(null);
      return;
    }
    this.silent = true;
    this.coreChanged = false;
    this.placementChanged = false;
    const wire = construction.wire;
    this.form.setValue({
      coreId: construction.coreId,
      materialId: construction.materialId,
      turns: typeof construction.turns === 'number' ? construction.turns : (known?.result.turns ?? null),
      placement: construction.placement,
      gap: typeof construction.gap === 'number' ? construction.gap : known ? gapInputOf(known.result.gap) : null,
      keepOut: construction.keepOut ?? null,
      wireKind: wire.kind,
      awg: wire.awg ?? null,
      strandDiameter: wire.strandDiameter ?? null,
      strands: wire.strands,
    });
    this.wireKind.set(wire.kind);
    this.placement.set(construction.placement);
    this.silent = false;
    if (known) this.view.set(known);
    // The sweeps (loss against frequency and load) are never stored; a fresh evaluation brings them.
    if (!known?.lossVersusFrequency || !known.lossMap) this.edits.next();
  }

  private constructionFromForm(): Construction | null {
    if (this.form.invalid) return null;
    const v = this.form.getRawValue();
    if (v.turns === null || v.strands === null) return null;
    const wire: Construction['wire'] =
      v.wireKind === 'awg' && v.awg !== null
        ? { kind: 'awg', awg: v.awg, strands: v.strands }
        : { kind: v.wireKind, strandDiameter: v.strandDiameter ?? 0, strands: v.wireKind === 'foil' ? 1 : v.strands };
    if (wire.strandDiameter === 0) return null;
    const { coreId, materialId, placement } = v;
    // The keep-out stays with the winding whatever else changes; empty follows the limits.
    const keepOut = v.keepOut === null ? {} : { keepOut: v.keepOut };
    if (this.coreChanged) {
      this.coreChanged = false;
      this.placementChanged = false;
      return { coreId, materialId, turns: 'auto', gap: 'auto', placement, ...keepOut, wire };
    }
    if (this.placementChanged) {
      this.placementChanged = false;
      return { coreId, materialId, turns: v.turns, gap: 'auto', placement, ...keepOut, wire };
    }
    return { coreId, materialId, turns: v.turns, gap: v.gap ?? 'auto', placement, ...keepOut, wire };
  }

  /** The three charts beside the figures, each with the words a screen reader gives for it. */
  protected readonly charts = computed(() => {
    const r = this.result();
    if (!r) return [];
    const power = (value: number) => show(value, 'power');
    const flux = (value: number) => show(value, 'fluxDensity');
    return [
      {
        title: 'Loss breakdown',
        options: this.lossChart(),
        label:
          `Losses: copper DC ${power(r.copper.dcLoss)}, copper AC ${power(r.copper.acLoss)}, ` +
          `${GAP_LOSS_WORDS.toLowerCase()} ${power(r.copper.gapLoss ?? 0)}, core ${power(r.coreLoss.loss)}`,
      },
      {
        title: 'Flux against Bsat at temperature',
        options: this.fluxChart(),
        label: `Peak flux ${flux(r.flux.peakAtMinimumSection)} against Bsat ${flux(r.flux.saturationAtHotSpot)}`,
      },
      {
        title: 'Loss against frequency',
        options: this.frequencyChart(),
        label: this.frequencyLabel(),
      },
      {
        title: 'Loss against load (loss map)',
        options: this.loadMapChart(),
        label: loadMapChartLabel(this.view()?.lossMap),
      },
    ];
  });

  private readonly lossChart = computed<EChartsCoreOption>(() => {
    const r = this.result();
    if (!r) return {};
    return themed(
      {
        animation: false,
        grid: { left: 56, right: 16, top: 16, bottom: 32 },
        tooltip: { trigger: 'axis' },
        xAxis: { type: 'category', data: ['Copper DC', 'Copper AC', 'Gap field', 'Core (iGSE)', 'Total'], axisLabel: { interval: 0 } },
        yAxis: { type: 'value', name: 'W' },
        series: [
          {
            type: 'bar',
            data: [r.copper.dcLoss, r.copper.acLoss, r.copper.gapLoss ?? 0, r.coreLoss.loss, r.totalLoss],
            label: { show: true, position: 'top', formatter: (p: { value: number }) => p.value.toFixed(3) },
          },
        ],
      },
      this.chartTheme(),
    );
  });

  private readonly fluxChart = computed<EChartsCoreOption>(() => {
    const r = this.result();
    if (!r) return {};
    const f = r.flux;
    const theme = this.chartTheme();
    return themed(
      {
        animation: false,
        grid: { left: 56, right: 90, top: 16, bottom: 32 },
        tooltip: { trigger: 'axis' },
        xAxis: { type: 'category', data: ['DC', 'Valley', 'Peak (load)', 'Peak (limit)'], axisLabel: { interval: 0 } },
        yAxis: { type: 'value', name: 'T', max: Math.ceil(Math.max(f.saturationAtHotSpot, f.peakAtMinimumSection) * 11) / 10 },
        series: [
          {
            type: 'bar',
            name: 'Flux density',
            data: [f.dc, Math.max(0, f.dc - f.swing / 2), f.dc + f.swing / 2, f.peakAtMinimumSection],
            markLine: {
              symbol: 'none',
              data: [
                {
                  yAxis: f.saturationAtHotSpot,
                  name: 'Bsat hot',
                  label: { formatter: `Bsat at ${Math.round(Math.min(r.thermal.hotSpot, THERMAL_MODEL_LIMIT))} °C` },
                  lineStyle: { color: theme.error },
                },
                {
                  yAxis: f.saturationAtHotSpot * (1 - f.requiredMargin),
                  name: 'limit',
                  label: { formatter: 'with margin' },
                  lineStyle: { type: 'dotted', color: theme.error },
                },
              ],
            },
          },
        ],
      },
      theme,
    );
  });

  private readonly frequencyChart = computed(() =>
    frequencyChartOptions(this.view()?.lossVersusFrequency ?? [], this.chartTheme(), this.spec()?.converter.frequency),
  );
  private readonly loadMapChart = computed(() => loadMapChartOptions(this.view()?.lossMap, this.chartTheme()));
  private readonly frequencyLabel = computed(() => frequencyChartLabel(this.view()?.lossVersusFrequency ?? []));
}
