import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { RankBy, SearchCandidate } from '@shared/engine/index';
import type { DesignSpec } from '@shared/schemas/designs';
import type { ECElementEvent, EChartsCoreOption, EChartsType } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import { Subject } from 'rxjs';

import { ChartThemes } from '../charts/chart-theme';
import { candidateRow, infeasibleRows, type CandidateRow } from './candidate-rows';
import { IDLE_SEARCH, searchStates, type SearchQuery } from './candidate-search';
import { CandidatesTable } from './candidates-table';
import { EXTRAPOLATED_LEGEND, FRONT_SERIES, candidatesChartOptions, pointOf, type FrontBy } from './candidates-chart';
import { DesignsApi, type MaterialView } from './designs-api';
import { show } from './format';
import { InfeasibleList } from './infeasible-list';
import { OBJECTIVES, objectiveOf, searchStatus } from './search-objectives';

interface PointPosition {
  key: string;
  label: string;
  x: number;
  y: number;
}

export const PAGE_SIZES = [20, 50, 100] as const;

/** Search, objective, the Pareto fronts, one page of ranked candidates, and why the other cores fail. */
@Component({
  selector: 'gw-candidates-panel',
  imports: [
    CandidatesTable,
    InfeasibleList,
    MatButtonModule,
    MatButtonToggleModule,
    MatPaginatorModule,
    MatProgressBarModule,
    NgxEchartsDirective,
  ],
  templateUrl: './candidates-panel.html',
  styleUrl: './candidates-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CandidatesPanel {
  private readonly api = inject(DesignsApi);
  private readonly chartTheme = inject(ChartThemes).current;
  readonly spec = input<DesignSpec | null>(null);
  readonly materials = input<MaterialView[]>([]);
  readonly picked = output<SearchCandidate>();

  protected readonly objectives = OBJECTIVES;
  protected readonly pageSizes = [...PAGE_SIZES];
  protected readonly extrapolatedLegend = EXTRAPOLATED_LEGEND;
  protected readonly rankBy = signal<RankBy>('smallest');
  protected readonly objective = computed(() => objectiveOf(this.rankBy()));
  protected readonly frontBy = signal<FrontBy>('volume');
  protected readonly pageSize = signal<number>(PAGE_SIZES[0]);

  private readonly queries = new Subject<SearchQuery>();
  private chartInstance: EChartsType | null = null;
  protected readonly state = toSignal(
    searchStates(this.queries, (query) => this.api.search(query)),
    { initialValue: IDLE_SEARCH },
  );
  protected readonly result = computed(() => this.state().result);

  protected readonly materialNames = computed(() => new Map(this.materials().map((m) => [m.id, m.name])));
  private readonly rowsOf = (candidates: readonly SearchCandidate[]) => candidates.map((c) => candidateRow(c, this.materialNames()));
  protected readonly rows = computed(() => this.rowsOf(this.result()?.candidates ?? []));
  private readonly frontByVolume = computed(() => this.rowsOf(this.result()?.paretoFront ?? []));
  private readonly frontByMass = computed(() => this.rowsOf(this.result()?.paretoFrontByMass ?? []));
  protected readonly front = computed(() => (this.frontBy() === 'volume' ? this.frontByVolume() : this.frontByMass()));
  protected readonly infeasible = computed(() => {
    const result = this.result();
    return result ? infeasibleRows(result, this.materialNames()) : [];
  });

  /** The chosen candidate: kept across pages and objectives while it is still a candidate of the same spec. */
  protected readonly selected = linkedSignal<{ rows: CandidateRow[]; spec: string }, CandidateRow | null>({
    source: () => ({
      rows: [...this.rows(), ...this.frontByVolume(), ...this.frontByMass()],
      spec: JSON.stringify(this.state().resultQuery?.spec ?? null),
    }),
    computation: (source, previous) => {
      const before = previous?.value;
      if (!before) return null;
      return source.rows.find((r) => r.key === before.key) ?? (previous.source.spec === source.spec ? before : null);
    },
  });
  protected readonly selectedKey = computed(() => this.selected()?.key ?? null);

  protected readonly stale = computed(() => {
    const searched = this.state().resultQuery?.spec;
    return !!searched && JSON.stringify(searched) !== JSON.stringify(this.spec());
  });

  protected readonly statusText = computed(() => {
    const s = this.state();
    if (s.status === 'error') return s.message;
    if (s.status === 'idle') return 'Run the search to list candidate cores, materials and wires.';
    if (s.status === 'running' && !s.result) return 'Searching every allowed core with every allowed material and wire…';
    if (s.status === 'running') return `Ranking the candidates, ${this.objective().order}…`;
    const staleNote = this.stale() ? 'The spec changed: these candidates are out of date; run the search again. ' : '';
    return staleNote + searchStatus(s.result!, s.ms);
  });

  /** "Ranked smallest part first: candidates 21–40 of 388." */
  protected readonly caption = computed(() => {
    const result = this.result();
    if (!result) return '';
    const { offset, total } = result.page;
    const range = total ? `candidates ${offset + 1}–${offset + result.candidates.length} of ${total}` : 'no candidate';
    return `Ranked ${objectiveOf(result.rankBy).order}: ${range}. Select a row, then use it; press Loss, Volume, Rise or Loss × vol. to rank by it.`;
  });

  protected readonly pageIndex = computed(() => {
    const page = this.result()?.page;
    return page ? Math.floor(page.offset / page.limit) : 0;
  });

  protected readonly chart = computed<EChartsCoreOption>(() =>
    candidatesChartOptions({ front: this.front(), page: this.rows(), by: this.frontBy(), selected: this.selected() }, this.chartTheme()),
  );
  /** Whether the chart has anything to draw; with no candidate at all a message stands in its place. */
  protected readonly plotted = computed(() => this.front().length > 0 || this.rows().length > 0);
  protected readonly pointPositions = signal<PointPosition[]>([]);

  /** A new search from the first page, with the spec as it is now. */
  protected runSearch(): void {
    const spec = this.spec();
    if (spec) this.queries.next({ spec, materialIds: this.materialIdsOf(spec), rankBy: this.rankBy(), offset: 0, limit: this.pageSize() });
  }

  /** Another objective ranks the list again from the first page, once there is a list to rank. */
  protected chooseObjective(rankBy: RankBy): void {
    this.rankBy.set(rankBy);
    const last = this.state().resultQuery;
    if (!last) return;
    const spec = this.spec() ?? last.spec;
    this.queries.next({ spec, materialIds: this.materialIdsOf(spec), rankBy, offset: 0, limit: this.pageSize() });
  }

  /** Another page (or page size) of the same search: the server ranks, the client only asks for the slice. */
  protected turnPage(event: PageEvent): void {
    const last = this.state().resultQuery;
    this.pageSize.set(event.pageSize);
    if (last) this.queries.next({ ...last, offset: event.pageIndex * event.pageSize, limit: event.pageSize });
  }

  private materialIdsOf(spec: DesignSpec): string[] {
    return spec.materialIds?.length
      ? spec.materialIds
      : this.materials()
          .filter((m) => !m.retired)
          .map((m) => m.id);
  }

  protected select(row: CandidateRow): void {
    this.selected.set(row);
  }

  protected selectByKey(key: string): void {
    const row = [...this.front(), ...this.rows()].find((r) => r.key === key);
    if (row) this.selected.set(row);
  }

  protected use(row: CandidateRow | null): void {
    if (row) this.picked.emit(row.candidate);
  }

  protected readonly selectedText = computed(() => {
    const row = this.selected();
    return row ? `${row.label}: ${show(row.totalLoss, 'power')}${row.extrapolated ? ', extrapolated loss data' : ''}` : 'none';
  });

  protected chartInit(instance: EChartsType): void {
    this.chartInstance = instance;
    instance.on('click', (event: ECElementEvent) => {
      const key = (event.data as { key?: string } | undefined)?.key;
      if (key) this.selectByKey(key);
    });
    instance.on('finished', () => this.measurePoints());
  }

  /** Screen positions of the front's points, for the keyboard list under the chart (and tests that click the chart). */
  private measurePoints(): void {
    const chart = this.chartInstance;
    if (!chart) return;
    const by = this.frontBy();
    const positions = this.front().map((r) => {
      const [x, y] = chart.convertToPixel({ seriesIndex: FRONT_SERIES }, pointOf(r, by)) as number[];
      return { key: r.key, label: `${r.coreId} · ${r.materialName}: ${show(r.totalLoss, 'power')}`, x: Math.round(x), y: Math.round(y) };
    });
    if (JSON.stringify(positions) !== JSON.stringify(this.pointPositions())) this.pointPositions.set(positions);
  }
}
