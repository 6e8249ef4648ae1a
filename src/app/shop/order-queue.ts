import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import { may } from '@shared/api/permissions';
import type { CallInput } from '@shared/api/endpoint';
import { listOrders } from '@shared/api/shop';

import { endpointResource } from '../core/api';
import { Session } from '../core/session';

import { OrderTable } from './order-table';

// Both tabs come from one request.
const EVERY_ORDER: CallInput<typeof listOrders> = { query: { status: 'all' } };

/** The winding shop's queue: open build orders first, completed ones on a second tab. */
@Component({
  selector: 'gw-order-queue',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatTabsModule, OrderTable, RouterLink],
  template: `
    <div class="gw-page">
      <h1>Winding shop</h1>
      <p class="gw-caution-box">{{ caution }}</p>
      @if (seesAccuracy()) {
        <p>
          <a mat-stroked-button routerLink="/shop/accuracy"
            ><mat-icon aria-hidden="true">scatter_plot</mat-icon> Measured versus predicted</a
          >
        </p>
      }
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading build orders" />
      }
      <mat-tab-group>
        <mat-tab [label]="'Open (' + open().length + ')'">
          <gw-order-table [orders]="open()" caption="Open build orders" empty="No open build orders." />
        </mat-tab>
        <mat-tab [label]="'Completed (' + complete().length + ')'">
          <gw-order-table [orders]="complete()" caption="Completed build orders" empty="No completed build orders yet." />
        </mat-tab>
      </mat-tab-group>
    </div>
  `,
  styles: `
    .gw-caution-box {
      border: 1px solid var(--mat-sys-outline);
      padding: 8px 12px;
      max-width: 80ch;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderQueue {
  protected readonly caution =
    'Build orders come from released revisions; every sheet is an engineering estimate. Build and test a prototype ' +
    '(inductance against DC current, temperature rise) before quantity builds, and treat ferrite cores as live unless insulated.';
  private readonly role = inject(Session).role;
  protected readonly seesAccuracy = computed(() => may(this.role(), 'predictionReport'));
  private readonly orders = endpointResource(listOrders, () => EVERY_ORDER, {
    select: (answer) => answer.orders,
    defaultValue: [],
  });
  protected readonly loading = this.orders.isLoading;
  protected readonly open = computed(() => this.ordersOrNone().filter((o) => o.status === 'open'));
  protected readonly complete = computed(() => this.ordersOrNone().filter((o) => o.status === 'complete'));

  // A resource that failed throws when read; the tabs then show no orders (the error handler has said why).
  private ordersOrNone() {
    return this.orders.hasValue() ? this.orders.value() : [];
  }
}
