import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { QuantityPipe } from '../units/quantity';
import type { InfeasibleRow } from './candidate-rows';

/** Why the cores and materials left out of the ranked list fail, closest to feasible first; folded until asked for. */
@Component({
  selector: 'gw-infeasible-list',
  imports: [QuantityPipe],
  template: `
    <details class="gw-infeasible" data-testid="infeasible">
      <summary>Why other cores fail ({{ rows().length }})</summary>
      @if (rows().length) {
        <div class="gw-scroll" role="region" aria-label="Cores that fail, scrollable" tabindex="0">
          <table>
            <caption class="gw-visually-hidden">
              Cores and materials that meet no limit set, with the reasons
            </caption>
            <thead>
              <tr>
                <th scope="col">Core</th>
                <th scope="col">Material</th>
                <th scope="col">Conductor</th>
                <th scope="col">Turns</th>
                <th scope="col">Gap</th>
                <th scope="col">Loss</th>
                <th scope="col">Why</th>
              </tr>
            </thead>
            <tbody>
              @for (r of rows(); track r.key) {
                <tr>
                  <td>{{ r.coreId }}</td>
                  <td>{{ r.materialName }}</td>
                  <td>{{ r.wireId }}</td>
                  <td>{{ r.turns ?? '—' }}</td>
                  <td>{{ r.gap }}</td>
                  <td>{{ r.totalLoss | quantity: 'power' : 3 }}</td>
                  <td>{{ r.reasons }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      } @else {
        <p>Every core and material evaluated has a candidate in the list.</p>
      }
    </details>
  `,
  styles: `
    summary {
      cursor: pointer;
      font: var(--mat-sys-title-small);
      padding: 4px 0;
    }
    .gw-scroll {
      max-height: 320px;
      overflow: auto;
    }
    table {
      border-collapse: collapse;
      font-size: 13px;
      line-height: 18px;
    }
    th,
    td {
      padding: 3px 8px;
      text-align: left;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    td:last-child {
      max-width: 60ch;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InfeasibleList {
  readonly rows = input.required<readonly InfeasibleRow[]>();
}
