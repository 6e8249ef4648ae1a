import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { FitAnswer } from '@shared/schemas/loss-points';

/** Each fitted band's k, α, β, ranges and quality, and the fitted temperature behaviour. */
@Component({
  selector: 'gw-fit-result',
  imports: [DecimalPipe, PercentPipe],
  template: `
    <p role="status">{{ fit().fits.length === 1 ? 'One fit' : fit().fits.length + ' bands' }} from {{ fit().pointCount }} points.</p>
    <div class="gw-table-scroll" role="region" aria-label="Fitted bands, scrollable" tabindex="0">
      <table class="gw-bands">
        <caption class="gw-visually-hidden">
          Steinmetz coefficients and fit quality per band
        </caption>
        <thead>
          <tr>
            <th scope="col">Band</th>
            <th scope="col">k (SI)</th>
            <th scope="col">α</th>
            <th scope="col">β</th>
            <th scope="col">Frequency (kHz)</th>
            <th scope="col">Peak flux (mT)</th>
            <th scope="col">RMS error</th>
            <th scope="col">Worst error</th>
            <th scope="col">Points</th>
          </tr>
        </thead>
        <tbody>
          @for (band of fit().fits; track $index) {
            <tr [class.gw-misses]="!band.meetsTarget">
              <td>{{ $index + 1 }}</td>
              <td>{{ band.k | number: '1.0-4' }}</td>
              <td>{{ band.alpha | number: '1.3-3' }}</td>
              <td>{{ band.beta | number: '1.3-3' }}</td>
              <td>{{ band.fittedFrequency[0] / 1000 | number: '1.0-3' }} – {{ band.fittedFrequency[1] / 1000 | number: '1.0-3' }}</td>
              <td>{{ band.fittedFlux[0] * 1000 | number: '1.0-2' }} – {{ band.fittedFlux[1] * 1000 | number: '1.0-2' }}</td>
              <td class="gw-rms">{{ band.rmsRelativeError | percent: '1.1-1' }}</td>
              <td class="gw-worst">
                {{ band.worstRelativeError | percent: '1.1-1' }} (point {{ band.worstPoint + 1 }})
                @if (!band.meetsTarget) {
                  <span class="gw-note">above the target</span>
                }
              </td>
              <td>{{ band.pointCount }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
    @if (fit().temperature; as t) {
      <h3>Temperature behaviour</h3>
      <p class="gw-temperature">
        Lowest loss at {{ t.lowestLossTemperature | number: '1.0-1' }} °C (loss factor {{ t.lowestLossFactor | number: '1.0-3' }} there),
        curvature {{ t.curvature | number: '1.0-7' }} /K², fitted from {{ t.fittedTemperature[0] | number: '1.0-1' }} to
        {{ t.fittedTemperature[1] | number: '1.0-1' }} °C; RMS error {{ t.rmsRelativeError | percent: '1.1-1' }}, worst
        {{ t.worstRelativeError | percent: '1.1-1' }} over {{ t.pointCount }} points.
        @if (t.constrained) {
          The free fit did not give a valid minimum, so it was constrained: curvature not negative, lowest-loss temperature within the
          measured temperatures.
        }
      </p>
    } @else {
      <p>Temperature behaviour not fitted: the material keeps its stored one.</p>
    }
    @if (fit().biasLoss; as b) {
      <h3>Core loss under DC bias</h3>
      <p class="gw-bias-loss">
        The loss doubles at a DC field of {{ b.doublingField | number: '1.0-1' }} A/m in the material and rises with steepness
        {{ b.steepness | number: '1.0-2' }} (factor 1 + (H/H₂)^m); RMS error {{ b.rmsRelativeError | percent: '1.1-1' }}, worst
        {{ b.worstRelativeError | percent: '1.1-1' }} (point {{ b.worstPoint + 1 }}) over the {{ b.pointCount }} points taken under bias.
        Accepting stores it with the coefficients.
      </p>
    }
  `,
  styles: `
    .gw-bands {
      border-collapse: collapse;
    }

    th,
    td {
      padding: 4px 12px;
      text-align: right;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }

    .gw-misses .gw-worst {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitResult {
  readonly fit = input.required<FitAnswer>();
}
