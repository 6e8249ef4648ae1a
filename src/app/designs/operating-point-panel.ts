import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { DesignSpec } from '@shared/schemas/designs';
import { axisFor } from '@shared/units/index';
import type { OperatingPointAnswer } from '@shared/schemas/calc-answers';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import { catchError, debounceTime, distinctUntilChanged, map, of, startWith, switchMap } from 'rxjs';

import { ChartThemes, themed } from '../charts/chart-theme';
import { errorMessageOf } from '../core/api-error';
import { DesignsApi } from './designs-api';
import { percent, show } from './format';

type OpState =
  { status: 'idle' } | { status: 'loading' } | { status: 'ok'; op: OperatingPointAnswer } | { status: 'error'; message: string };

/** The operating point beside the spec form: recalculated as the spec changes (debounced, latest wins). */
@Component({
  selector: 'gw-operating-point-panel',
  imports: [NgxEchartsDirective, MatProgressBarModule],
  template: `
    <section class="gw-op" aria-labelledby="gw-op-title" aria-live="polite">
      <h2 id="gw-op-title">Operating point</h2>
      @switch (state().status) {
        @case ('idle') {
          <p>Fill in Vin, Vout, Iout, the frequency and the ripple to see the operating point.</p>
        }
        @case ('loading') {
          <mat-progress-bar mode="indeterminate" aria-label="Calculating the operating point" />
        }
        @case ('error') {
          <p class="gw-form-error" role="alert">{{ errorText() }}</p>
        }
      }
      @if (op(); as op) {
        <dl class="gw-figures" data-testid="operating-point">
          <dt>Duty cycle</dt>
          <dd>{{ pct(op.dutyAtVinMax) }} … {{ pct(op.dutyAtVinMin) }}</dd>
          <dt>Inductance (minimum)</dt>
          <dd data-figure="inductance">{{ fmt(op.inductanceMin, 'inductance') }}</dd>
          <dt>Nominal to build</dt>
          <dd>{{ fmt(op.inductanceNominal, 'inductance') }}</dd>
          <dt>Ripple at Vin max</dt>
          <dd>{{ fmt(op.rippleAtVinMax, 'current') }} p-p</dd>
          <dt>Peak current</dt>
          <dd data-figure="peak">{{ fmt(op.peakCurrent, 'current') }}</dd>
          <dt>RMS current</dt>
          <dd>{{ fmt(op.rmsCurrent, 'current') }}</dd>
          <dt>Saturation check at</dt>
          <dd>{{ fmt(op.saturationCheckCurrent, 'current') }}</dd>
        </dl>
        @for (w of op.warnings; track w.code) {
          <p class="gw-warning">{{ w.message }}</p>
        }
        <div class="gw-chart" echarts [options]="chart()" role="img" [attr.aria-label]="chartLabel()"></div>
      }
    </section>
  `,
  styles: `
    .gw-figures {
      display: grid;
      grid-template-columns: auto auto;
      gap: 4px 16px;
      margin: 0 0 8px;
    }
    .gw-chart {
      height: 220px;
    }
    .gw-warning {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OperatingPointPanel {
  private readonly api = inject(DesignsApi);
  private readonly chartTheme = inject(ChartThemes).current;
  readonly spec = input<DesignSpec | null>(null);

  protected readonly state = toSignal(
    toObservable(this.spec).pipe(
      map((spec) => (spec ? JSON.stringify(spec) : '')),
      distinctUntilChanged(),
      debounceTime(250),
      switchMap((text) => {
        if (!text) return of<OpState>({ status: 'idle' });
        const spec = JSON.parse(text) as DesignSpec;
        return this.api.operatingPoint(spec).pipe(
          map((op): OpState => ({ status: 'ok', op })),
          catchError((error: unknown) => of<OpState>({ status: 'error', message: errorMessageOf(error) })),
          startWith<OpState>({ status: 'loading' }),
        );
      }),
    ),
    { initialValue: { status: 'idle' } as OpState },
  );
  protected readonly op = computed(() => {
    const s = this.state();
    return s.status === 'ok' ? s.op : null;
  });
  protected readonly errorText = computed(() => {
    const s = this.state();
    return s.status === 'error' ? s.message : '';
  });
  protected readonly fmt = show;
  protected readonly pct = percent;

  protected readonly chartLabel = computed(() => {
    const op = this.op();
    return op
      ? `Inductor current over two periods at Vin max: valley ${show(op.valleyCurrent, 'current')}, peak ${show(op.peakCurrent, 'current')}`
      : '';
  });

  protected readonly chart = computed<EChartsCoreOption>(() => {
    const op = this.op();
    const spec = this.spec();
    if (!op || !spec) return {};
    const period = 1 / spec.converter.frequency;
    const d = op.dutyAtVinMax;
    const time = axisFor('s', [2 * period]);
    const points: [number, number][] = [];
    for (let k = 0; k < 2; k++) {
      points.push([time.toAxis(k * period), op.valleyCurrent], [time.toAxis((k + d) * period), op.peakCurrent]);
    }
    points.push([time.toAxis(2 * period), op.valleyCurrent]);
    return themed(
      {
        animation: false,
        // Right: room for the Iout line's label beyond the plot.
        grid: { left: 48, right: 40, top: 24, bottom: 36 },
        tooltip: { trigger: 'axis' },
        xAxis: { type: 'value', name: time.unit, nameLocation: 'middle', nameGap: 24, max: time.toAxis(2 * period) },
        yAxis: { type: 'value', name: 'A', scale: true },
        series: [
          {
            type: 'line',
            name: 'Inductor current',
            data: points,
            showSymbol: false,
            markLine: { symbol: 'none', data: [{ yAxis: spec.converter.ioutMax, name: 'Iout' }], label: { formatter: 'Iout' } },
          },
        ],
      },
      this.chartTheme(),
    );
  });
}
