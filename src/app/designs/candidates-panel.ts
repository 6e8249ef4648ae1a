import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import type { SearchCandidate, SearchResult } from '@shared/engine/index';
import type { DesignSpec } from '@shared/schemas/designs';
import type { ECElementEvent, EChartsCoreOption, EChartsType } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import { Subject, catchError, distinctUntilChanged, map, merge, of, skip, startWith, switchMap } from 'rxjs';

import { errorMessageOf } from '../core/api-error';
import { QuantityPipe } from '../units/quantity';
import { candidateRows, type CandidateRow } from './candidate-rows';
import { VOLUME_AXIS, candidatesChartOptions } from './candidates-chart';
import { DesignsApi, type MaterialView } from './designs-api';
import { percent, show } from './format';

type SearchState =
  | { status: 'idle' }
  | { status: 'stale' }
  | { status: 'running'; startedAt: number }
  | { status: 'done'; result: SearchResult; ms: number }
  | { status: 'error'; message: string };

interface PointPosition {
  key: string;
  label: string;
  x: number;
  y: number;
}

/** The scatter chart's x axis: core volume in cm³. */

@Component({
  selector: 'gw-candidates-panel',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    NgxEchartsDirective,
    QuantityPipe,
  ],
  templateUrl: './candidates-panel.html',
  styleUrl: './candidates-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CandidatesPanel {
  private readonly api = inject(DesignsApi);
  readonly spec = input<DesignSpec | null>(null);
  readonly materials = input<MaterialView[]>([]);
  readonly picked = output<SearchCandidate>();

  private readonly sort = viewChild(MatSort);
  private readonly runs = new Subject<DesignSpec>();
  private chartInstance: EChartsType | null = null;

  /** A new spec cancels a running search and marks finished results stale; "search" starts one. */
  protected readonly state = toSignal(
    merge(
      this.runs.pipe(map((spec) => ({ spec }))),
      toObservable(this.spec).pipe(
        map((spec) => JSON.stringify(spec)),
        distinctUntilChanged(),
        skip(1),
        map(() => ({ spec: null })),
      ),
    ).pipe(
      switchMap(({ spec }) => {
        if (!spec) return of<SearchState>(this.hasResults() ? { status: 'stale' } : { status: 'idle' });
        const startedAt = performance.now();
        const materialIds = spec.materialIds?.length
          ? spec.materialIds
          : this.materials()
              .filter((m) => !m.retired)
              .map((m) => m.id);
        return this.api.search(spec, materialIds).pipe(
          map((result): SearchState => ({ status: 'done', result, ms: performance.now() - startedAt })),
          catchError((error: unknown) => of<SearchState>({ status: 'error', message: errorMessageOf(error) })),
          startWith<SearchState>({ status: 'running', startedAt }),
        );
      }),
    ),
    { initialValue: { status: 'idle' } as SearchState },
  );

  /** Finished searches so far, on the status line for anyone timing the search. */
  protected readonly searchesDone = signal(0);
  protected readonly result = computed(() => {
    const s = this.state();
    return s.status === 'done' ? s.result : null;
  });
  private lastResult: SearchResult | null = null;
  private hasResults(): boolean {
    return this.lastResult !== null;
  }

  protected readonly materialNames = computed(() => new Map(this.materials().map((m) => [m.id, m.name])));
  protected readonly rows = computed(() => {
    const result = this.result();
    return result ? candidateRows(result, this.materialNames()) : [];
  });
  protected readonly familyFilter = signal<string>('');
  protected readonly materialFilter = signal<string>('');
  protected readonly feasibilityFilter = signal<string>('all');
  /** The filters above the table, each with its choices as [value, label]; "All" keeps every row. */
  protected readonly filters = computed(() => [
    {
      label: 'Family',
      value: this.familyFilter,
      options: [['', 'All'], ...[...new Set(this.rows().map((r) => r.family))].sort().map((f) => [f, f])],
    },
    {
      label: 'Material',
      value: this.materialFilter,
      options: [
        ['', 'All'],
        ...new Map(
          this.rows()
            .filter((r) => r.materialId)
            .map((r) => [r.materialId, r.materialName]),
        ),
      ],
    },
    {
      label: 'Feasibility',
      value: this.feasibilityFilter,
      options: [
        ['all', 'All'],
        ['feasible', 'Feasible'],
        ['infeasible', 'Infeasible'],
      ],
    },
  ]);
  protected readonly selectedKey = signal<string | null>(null);
  protected readonly selected = computed(() => this.rows().find((r) => r.key === this.selectedKey()) ?? null);
  protected readonly dataSource = new MatTableDataSource<CandidateRow>([]);
  protected readonly columns = ['rank', 'core', 'material', 'wire', 'turns', 'totalLoss', 'volume', 'rise', 'fill', 'fluxMargin', 'notes'];
  protected readonly pointPositions = signal<PointPosition[]>([]);
  protected readonly fmt = show;
  protected readonly pct = percent;

  constructor() {
    this.dataSource.sortingDataAccessor = (row, column) => {
      const value = (row as unknown as Record<string, unknown>)[column];
      // Unevaluated rows sort last whichever way.
      return typeof value === 'number'
        ? value
        : column === 'core'
          ? row.coreId
          : column === 'material'
            ? row.materialName
            : Number.MAX_VALUE;
    };
    this.dataSource.filterPredicate = (row) =>
      (!this.familyFilter() || row.family === this.familyFilter()) &&
      (!this.materialFilter() || row.materialId === this.materialFilter()) &&
      (this.feasibilityFilter() === 'all' || row.feasible === (this.feasibilityFilter() === 'feasible'));
    effect(() => {
      if (this.state().status === 'done') this.searchesDone.update((n) => n + 1);
    });
    effect(() => {
      this.lastResult = this.result() ?? (this.state().status === 'stale' ? this.lastResult : null);
      this.dataSource.data = this.rows();
      this.selectedKey.set(null);
    });
    effect(() => {
      this.familyFilter();
      this.materialFilter();
      this.feasibilityFilter();
      this.dataSource.filter = `${this.familyFilter()}|${this.materialFilter()}|${this.feasibilityFilter()}|${Date.now()}`;
    });
    effect(() => {
      const sort = this.sort();
      if (sort) this.dataSource.sort = sort;
    });
  }

  protected runSearch(): void {
    const spec = this.spec();
    if (spec) this.runs.next(spec);
  }

  protected select(row: CandidateRow): void {
    this.selectedKey.set(row.key);
  }

  protected use(row: CandidateRow | null): void {
    if (row?.candidate) this.picked.emit(row.candidate);
  }

  protected readonly statusText = computed(() => {
    const s = this.state();
    switch (s.status) {
      case 'idle':
        return 'Run the search to list candidate cores, materials and wires.';
      case 'stale':
        return 'The spec changed: the candidates below are out of date. Run the search again.';
      case 'running':
        return 'Searching every allowed core with every allowed material and wire…';
      case 'error':
        return s.message;
      case 'done':
        return `${s.result.counts.feasible} feasible of ${s.result.counts.evaluated} evaluated (${s.result.counts.cores} cores × ${s.result.counts.materials} materials), ${Math.round(s.ms)} ms.`;
    }
  });

  protected readonly chart = computed<EChartsCoreOption>(() => candidatesChartOptions(this.rows(), this.selectedKey()));

  protected chartInit(instance: EChartsType): void {
    this.chartInstance = instance;
    instance.on('click', (event: ECElementEvent) => {
      const key = (event.data as { key?: string } | undefined)?.key;
      if (key) this.selectedKey.set(key);
    });
    instance.on('finished', () => this.measurePoints());
  }

  /** Screen positions of the Pareto points, for the keyboard list under the chart (and tests that click the chart). */
  private measurePoints(): void {
    const chart = this.chartInstance;
    if (!chart) return;
    const front = this.rows().filter((r) => r.feasible && r.pareto);
    const positions = front.map((r) => {
      const [x, y] = chart.convertToPixel({ seriesIndex: 1 }, [VOLUME_AXIS.toAxis(r.volume!), r.totalLoss!]) as number[];
      return { key: r.key, label: `${r.coreId} · ${r.materialName}: ${show(r.totalLoss, 'power')}`, x: Math.round(x), y: Math.round(y) };
    });
    const before = JSON.stringify(this.pointPositions());
    if (JSON.stringify(positions) !== before) this.pointPositions.set(positions);
  }
}
