import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Router, RouterLink } from '@angular/router';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { Observable } from 'rxjs';

import { Notifier } from '../core/notifier';
import { ChartThemes } from '../charts/chart-theme';
import { fitChartOptions, residualChartOptions } from './fit-chart-options';
import { FitResult } from './fit-result';
import { LossPointUpload } from './loss-point-upload';
import { LossPointsApi, type FitAnswer, type FitOptions, type LossPointCommit } from './loss-points-api';
import { LossPointsTable } from './loss-points-table';
import { RequestFailureMessage, requestFailureOf, type RequestFailure } from '../ui/request-failure';

/** The loss points of one material version (/materials/:id/loss-points): the table, a CSV upload, and fitting k, α, β to them. */
@Component({
  selector: 'gw-loss-points-page',
  imports: [
    RequestFailureMessage,
    FitResult,
    LossPointUpload,
    LossPointsTable,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    NgxEchartsDirective,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './loss-points-page.html',
  styleUrls: ['../library/library-page.scss', './loss-points-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LossPointsPage {
  private readonly api = inject(LossPointsApi);
  private readonly notifier = inject(Notifier);
  private readonly router = inject(Router);
  private readonly chartTheme = inject(ChartThemes).current;

  /** The material version's id, from the route. */
  readonly id = input.required<string>();

  protected readonly answer = this.api.pointsResource(() => this.id());
  protected readonly points = computed(() => this.answer.value()?.points ?? []);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    mode: this.fb.control<FitOptions['mode']>('whole'),
    worstErrorPercent: [10, [Validators.required, Validators.min(0.1), Validators.max(1000)]],
    temperature: [true],
    atTemperature: [25, [Validators.min(-60), Validators.max(250)]],
  });
  protected readonly fit = signal<FitAnswer | null>(null);
  protected readonly fitted = signal<FitOptions | null>(null);
  protected readonly band = signal(0);
  protected readonly busy = signal(false);
  /** The server's refusal, by field (its one error shape), shown beside the fit options. */
  protected readonly failure = signal<RequestFailure | null>(null);
  protected readonly fitChart = computed(() => {
    const fit = this.fit();
    return fit ? fitChartOptions(this.points(), fit, this.chartTheme()) : null;
  });
  protected readonly residualChart = computed(() => {
    const fit = this.fit();
    return fit ? residualChartOptions(this.points(), fit, this.chartTheme()) : null;
  });

  protected onCommitted(result: LossPointCommit): void {
    this.notifier.info(`Saved ${result.pointCount} points as version ${result.version}.`);
    this.fit.set(null);
    // The points now belong to the new version: show that one.
    void this.router.navigate(['/materials', result.materialId, 'loss-points']);
  }

  protected runFit(): void {
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    const options: FitOptions = {
      mode: v.mode,
      maxWorstError: v.worstErrorPercent / 100,
      temperature: v.temperature,
      atTemperature: v.temperature ? undefined : v.atTemperature,
    };
    this.call(this.api.fit(this.id(), options), (fit) => {
      this.fit.set(fit);
      this.fitted.set(options);
      this.band.set(0);
    });
  }

  protected accept(): void {
    const options = this.fitted();
    if (!options) return;
    const band = options.mode === 'bands' ? this.band() : undefined;
    this.call(this.api.accept(this.id(), { ...options, band }), (accepted) => {
      this.notifier.info(`Fit accepted as version ${accepted.material.version} of ${accepted.material.name}.`);
      void this.router.navigate(['/materials']);
    });
  }

  private call<T>(request: Observable<T>, done: (answer: T) => void): void {
    this.busy.set(true);
    this.failure.set(null);
    request.subscribe({
      next: (answer) => {
        this.busy.set(false);
        done(answer);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(requestFailureOf(error));
      },
    });
  }
}
