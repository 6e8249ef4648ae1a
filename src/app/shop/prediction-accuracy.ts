import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { microhenry, milliohm } from '@shared/shop/sheet-text';
import { NgxEchartsDirective } from 'ngx-echarts';

import { accuracyChartOptions } from './accuracy-chart';
import { ShopApi, type PredictionReport, type PredictionSample, type RatioSummary } from './shop-api';

/** Every built unit's measurements against the frozen prediction, and the prediction error by material and by core. */
@Component({
  selector: 'gw-prediction-accuracy',
  imports: [MatPaginatorModule, MatProgressBarModule, MatSortModule, MatTableModule, NgxEchartsDirective],
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

  protected readonly report = signal<PredictionReport | null>(null);
  protected readonly loading = signal(true);
  protected readonly chartOptions = computed(() => accuracyChartOptions(this.report()?.units ?? []));
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
  protected readonly microhenry = microhenry;
  protected readonly milliohm = milliohm;

  constructor() {
    inject(ShopApi)
      .predictionReport()
      .subscribe({
        next: (report) => {
          this.report.set(report);
          this.units.data = report.units;
          this.loading.set(false);
        },
        error: () => this.loading.set(false),
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
