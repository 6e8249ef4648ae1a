import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { CoreMaterial } from '@shared/engine/types';

import { QuantityPipe } from '../units/quantity';

/** The frequency and flux range a material's Steinmetz fit holds for, e.g. "50–300 kHz, 20–250 mT". */
@Component({
  selector: 'gw-fitted-range',
  imports: [QuantityPipe],
  template: `{{ material().fitFrequencyMin | quantity: 'kHz' : '1.0-1' : 'bare' }}–{{
      material().fitFrequencyMax | quantity: 'kHz' : '1.0-1'
    }}, {{ material().fitFluxMin | quantity: 'mT' : '1.0-0' : 'bare' }}–{{ material().fitFluxMax | quantity: 'mT' : '1.0-0' }}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FittedRange {
  readonly material = input.required<Pick<CoreMaterial, 'fitFrequencyMin' | 'fitFrequencyMax' | 'fitFluxMin' | 'fitFluxMax'>>();
}
