import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { listOrders } from '@shared/api/shop';

import { endpointResource } from '../core/api';
import { OrderTable } from '../shop/order-table';

/** The build orders released from a design, each linking to its order page with the units built. */
@Component({
  selector: 'gw-design-orders',
  imports: [OrderTable],
  template: `
    <section aria-labelledby="gw-design-orders-title">
      <h2 id="gw-design-orders-title">Build orders and units</h2>
      @if (orders.error()) {
        <p class="gw-form-error" role="alert">The build orders of this design could not be loaded.</p>
      } @else {
        <gw-order-table
          [orders]="orders.value()"
          caption="Build orders of this design"
          empty="No build orders yet: a released revision creates one."
        />
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignOrders {
  readonly designId = input.required<number>();

  protected readonly orders = endpointResource(
    listOrders,
    () => ({ query: { status: 'all' as const, designId: String(this.designId()) } }),
    { select: (answer) => answer.orders, defaultValue: [] },
  );
}
