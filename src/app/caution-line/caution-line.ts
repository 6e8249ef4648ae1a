import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The safety caution shown at the foot of every screen. */
@Component({
  selector: 'gw-caution-line',
  template: `
    <p class="gw-caution">
      Gapwright results are engineering estimates. Inductors get hot and can saturate; mains-connected designs need insulation set by the
      applicable standards and local codes. Have every design reviewed by a qualified engineer.
    </p>
  `,
  styles: `
    .gw-caution {
      margin: 0;
      max-width: 80ch;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionLine {}
