import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** The bar while something loads, and the alert when it failed: the one look every page gives these. */
@Component({
  selector: 'gw-load-state',
  imports: [MatProgressBarModule],
  template: `
    @if (loading()) {
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="loadingLabel()" />
    }
    @if (failure(); as message) {
      <p class="gw-form-error" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadState {
  readonly loading = input(false);
  /** What the bar is for, read out by screen readers ("Loading users"). */
  readonly loadingLabel = input.required<string>();
  /** The failure to show; nothing while null or empty. */
  readonly failure = input<string | null>(null);
}
