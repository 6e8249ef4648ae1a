import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CornerRow } from '@shared/engine/corners';

import { QuantityPipe } from '../units/quantity';
import { percent } from './format';

/**
 * The saturation and inductance checks at their corners: nominal L at the predicted hot spot, and the low and high
 * tolerance ends at the hottest temperature the limits allow. Results saved before the corners existed show nothing.
 */
@Component({
  selector: 'gw-corner-table',
  imports: [QuantityPipe],
  template: `
    @if (rows().length) {
      <table class="gw-corners">
        <caption>
          Worst-case corners at the saturation-check current
        </caption>
        <thead>
          <tr>
            <th scope="col">Corner</th>
            <th scope="col">Inductance</th>
            <th scope="col">Peak flux</th>
            <th scope="col">Bsat at</th>
            <th scope="col">Margin</th>
            <th scope="col">Check</th>
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.corner) {
            <tr [attr.data-corner]="row.corner" [class.gw-bad]="!row.pass">
              <th scope="row">{{ row.label }}</th>
              <td>{{ row.inductance | quantity: 'inductance' }}</td>
              <td>{{ row.peakFlux | quantity: 'fluxDensity' : 3 }}</td>
              <td>{{ row.saturationFlux | quantity: 'fluxDensity' : 3 }} at {{ row.temperature | quantity: 'temperature' : 3 }}</td>
              <td>{{ pct(row.margin) }}</td>
              <td>{{ row.pass ? 'passes' : 'fails' }}</td>
            </tr>
          }
        </tbody>
      </table>
    }
  `,
  styles: `
    .gw-corners {
      border-collapse: collapse;
      margin-top: 8px;
      font-variant-numeric: tabular-nums;
    }
    caption {
      font: var(--mat-sys-title-small);
      text-align: start;
      padding-bottom: 4px;
    }
    th,
    td {
      text-align: start;
      padding: 2px 12px 2px 0;
    }
    thead th,
    tbody th {
      color: var(--mat-sys-on-surface-variant);
      font-weight: normal;
    }
    .gw-bad td {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CornerTable {
  /** The evaluation's corners; absent on results saved before they were computed. */
  readonly corners = input<readonly CornerRow[] | undefined>(undefined);

  protected readonly pct = percent;
  protected readonly rows = computed(() => {
    const corners = this.corners() ?? [];
    const nominal = corners.find((c) => c.corner === 'nominal');
    // The tolerance the engine applied, read back from the rows themselves.
    const tolerance = nominal
      ? Math.round(((corners.find((c) => c.corner === 'high')?.inductance ?? 0) / nominal.inductance - 1) * 100)
      : 0;
    const labels: Record<CornerRow['corner'], string> = {
      nominal: 'Nominal L, predicted hot spot',
      low: `L −${tolerance} %, hottest allowed`,
      high: `L +${tolerance} %, hottest allowed`,
    };
    return corners.map((c) => ({ ...c, label: labels[c.corner] }));
  });
}
