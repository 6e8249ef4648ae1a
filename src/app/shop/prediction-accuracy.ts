import { ChangeDetectionStrategy, Component, computed, effect, inject, viewChild } from '@angular/core';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { predictionReport } from '@shared/api/shop';
import type { PredictionSample, RatioSummary } from '@shared/schemas/shop';
import { NgxEchartsDirective } from 'ngx-echarts';

import { endpointResource } from '../core/api';
import { QuantityPipe } from '../units/quantity';
import { ChartThemes, themed } from '../charts/chart-theme';
import { accuracyChartOptions } from './accuracy-chart';

/** Every built unit's measurements against the frozen prediction, and the prediction error by material and by core. */
@Component({
  selector: 'gw-prediction-accuracy',
  imports: [MatPaginatorModule, MatProgressBarModule, MatSortModule, MatTableModule, NgxEchartsDirective, QuantityPipe],
  templateUrl: './prediction-accuracy.html',
  styles: `
    .gw-chart {
      height: 360px;
      max-width: 720px;
    }
    .gw-caution-box {
      border: 1px solid var(--mat-sys-outline);
      padding: 8px 12px;
      max-width: 80ch;
    }
    .gw-fail {
      color: var(--mat-sys-error);
    }
    .gw-summaries {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(360px, 1fr));
      gap: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PredictionAccuracy {
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);

  private readonly resource = endpointResource(predictionReport, () => ({}));
  protected readonly report = computed(() => (this.resource.hasValue() ? this.resource.value() : null));
  protected readonly loading = this.resource.isLoading;
  private readonly chartTheme = inject(ChartThemes).current;
  protected readonly chartOptions = computed(() => themed(accuracyChartOptions(this.report()?.units ?? []), this.chartTheme()));
  protected readonly unitColumns = [
    'orderNumber',
    'designNumber',
    'material',
    'core',
    'inductance',
    'inductanceRatio',
    'resistance',
    'resistanceRatio',
    'passed',
  ];
  protected readonly summaryColumns = ['key', 'units', 'lMean', 'lSpread', 'rMean', 'rSpread'];
  protected readonly units = new MatTableDataSource<PredictionSample>([]);

  constructor() {
    effect(() => {
      this.units.data = this.report()?.units ?? [];
    });
    effect(() => {
      this.units.sort = this.sort();
      this.units.paginator = this.paginator();
    });
  }

  protected ratio(value: number): string {
    return value.toFixed(3);
  }

  protected summaryRows(kind: 'byMaterial' | 'byCore'): RatioSummary[] {
    return this.report()?.[kind] ?? [];
  }
}
