import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { LossPoint } from '@shared/fitting/loss-points';

/** The loss points of one material version in the units engineers read them in (kHz, mT, °C, kW/m³, A/m). */
@Component({
  selector: 'gw-loss-points-table',
  imports: [DecimalPipe],
  template: `
    <div class="gw-table-scroll" role="region" aria-label="Loss points, scrollable" tabindex="0">
      <table class="gw-points">
        <caption class="gw-visually-hidden">
          Loss points of this material version, in file order
        </caption>
        <thead>
          <tr>
            <th scope="col">#</th>
            <th scope="col">Frequency (kHz)</th>
            <th scope="col">Peak flux B̂ (mT)</th>
            <th scope="col">Temperature (°C)</th>
            <th scope="col">Loss density (kW/m³)</th>
            <th scope="col">DC bias (A/m)</th>
            <th scope="col">Source</th>
          </tr>
        </thead>
        <tbody>
          @for (p of points(); track $index) {
            <tr>
              <td>{{ $index + 1 }}</td>
              <td>{{ p.frequency / 1000 | number: '1.0-3' }}</td>
              <td>{{ p.peakFlux * 1000 | number: '1.0-2' }}</td>
              <td>{{ p.temperature | number: '1.0-1' }}</td>
              <td>{{ p.lossDensity / 1000 | number: '1.0-3' }}</td>
              <td>{{ p.dcBias === undefined ? '—' : (p.dcBias | number: '1.0-1') }}</td>
              <td>{{ p.source ?? '—' }}</td>
            </tr>
          } @empty {
            <tr>
              <td colspan="7">No loss points on this version yet.</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styles: `
    .gw-points {
      border-collapse: collapse;
      width: 100%;
    }

    th,
    td {
      padding: 4px 12px;
      text-align: right;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }

    th:last-child,
    td:last-child {
      text-align: left;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LossPointsTable {
  readonly points = input.required<readonly LossPoint[]>();
}
