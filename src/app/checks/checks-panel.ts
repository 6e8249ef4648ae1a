import { DecimalPipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { may } from '@shared/api/permissions';
import type { CheckKind, CircuitCorner, ExportedModelRun, RevisionCheck, RevisionChecks } from '@shared/schemas/checks';
import type { EChartsCoreOption } from 'echarts/core';
import { NgxEchartsDirective } from 'ngx-echarts';
import type { Observable } from 'rxjs';

import { ChartThemes } from '../charts/chart-theme';
import { errorMessageOf } from '../core/api-error';
import { Session } from '../core/session';
import { ChecksApi } from './checks-api';
import { circuitChartLabel, circuitChartOptions } from './circuit-chart';
import { FieldCheckView } from './field-check-view';

/** How often a queued or running check is asked about (ms). */
export const POLL_MS = 2000;

/** The revision's independent checks (the circuit check for now): run, follow, cancel, and the results. */
@Component({
  selector: 'gw-checks-panel',
  imports: [MatButtonModule, MatProgressBarModule, NgxEchartsDirective, DecimalPipe, NgTemplateOutlet, FieldCheckView],
  templateUrl: './checks-panel.html',
  styleUrl: './checks-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChecksPanel {
  private readonly api = inject(ChecksApi);
  private readonly session = inject(Session);

  readonly designId = input.required<number>();
  readonly revision = input.required<number>();

  protected readonly answer = signal<RevisionChecks | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly busy = signal(false);
  private readonly refresh = signal(0);

  protected readonly circuit = computed<RevisionCheck | null>(() => this.latest('circuit'));
  protected readonly field = computed<RevisionCheck | null>(() => this.latest('field'));
  protected readonly open = computed(() => this.isOpen(this.circuit()));
  protected readonly fieldOpen = computed(() => this.isOpen(this.field()));
  protected readonly circuitResult = computed(() => {
    const c = this.circuit();
    return c?.status === 'done' && c.result?.kind === 'circuit' ? c.result : null;
  });
  protected readonly fieldResult = computed(() => {
    const c = this.field();
    return c?.status === 'done' && c.result?.kind === 'field' ? c.result : null;
  });
  protected readonly mayRun = computed(() => may(this.session.role(), 'library') && (this.answer()?.canRun ?? false));
  private readonly chartTheme = inject(ChartThemes).current;
  protected chart(corner: CircuitCorner): EChartsCoreOption {
    return circuitChartOptions(corner, this.chartTheme());
  }
  protected readonly chartLabel = circuitChartLabel;

  constructor() {
    // Reads the checks for the revision shown, and again every POLL_MS while one is queued or running.
    effect((onCleanup) => {
      const [id, rev] = [this.designId(), this.revision()];
      this.refresh();
      let timer: ReturnType<typeof setTimeout> | undefined;
      const sub = this.api.list(id, rev).subscribe({
        next: (answer) => {
          this.answer.set(answer);
          this.error.set(null);
          if (answer.checks.some((c) => c.status === 'queued' || c.status === 'running')) {
            timer = setTimeout(() => this.refresh.update((n) => n + 1), POLL_MS);
          }
        },
        error: (err: unknown) => this.error.set(errorMessageOf(err)),
      });
      onCleanup(() => {
        sub.unsubscribe();
        clearTimeout(timer);
      });
    });
  }

  private latest(kind: CheckKind): RevisionCheck | null {
    return this.answer()?.checks.find((c) => c.kind === kind) ?? null;
  }

  private isOpen(check: RevisionCheck | null): boolean {
    return check?.status === 'queued' || check?.status === 'running';
  }

  protected run(kind: CheckKind = 'circuit'): void {
    this.act(this.api.run(this.designId(), this.revision(), kind));
  }

  protected cancel(check: RevisionCheck): void {
    this.act(this.api.cancel(this.designId(), this.revision(), check.id));
  }

  private act(call: Observable<RevisionCheck>): void {
    this.busy.set(true);
    call.subscribe({
      next: () => {
        this.busy.set(false);
        this.refresh.update((n) => n + 1);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.error.set(errorMessageOf(err));
      },
    });
  }

  protected rows(corner: CircuitCorner) {
    return [
      {
        label: 'Ripple (p-p)',
        simulated: corner.simulated.ripple,
        predicted: corner.predicted.ripple,
        diff: corner.differencePercent.ripple,
      },
      { label: 'Peak', simulated: corner.simulated.peak, predicted: corner.predicted.peak, diff: corner.differencePercent.peak },
      {
        label: 'Average',
        simulated: corner.simulated.average,
        predicted: corner.predicted.average,
        diff: corner.differencePercent.average,
      },
    ];
  }

  /** The exported subcircuit's run: its current and the power it dissipates against the engine's. */
  protected exportedRows(run: ExportedModelRun) {
    return [
      { label: 'Ripple (p-p), A', simulated: run.simulated.ripple, predicted: run.predicted.ripple, diff: run.differencePercent.ripple },
      { label: 'Peak, A', simulated: run.simulated.peak, predicted: run.predicted.peak, diff: run.differencePercent.peak },
      {
        label: 'Dissipated / total loss, W',
        simulated: run.simulated.dissipation,
        predicted: run.predicted.loss,
        diff: run.differencePercent.dissipation,
      },
    ];
  }
}
