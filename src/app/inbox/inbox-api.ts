import { Injectable, inject } from '@angular/core';
import { inbox } from '@shared/api/inbox';
import type { InboxItem } from '@shared/schemas/inbox';
import type { Observable } from 'rxjs';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

export type { InboxItem } from '@shared/schemas/inbox';

/** Where an inbox item leads: a build order for the shop, otherwise the design. */
export function inboxLink(item: InboxItem): string {
  return item.kind === 'build' && item.orderId !== undefined ? `/shop/orders/${item.orderId}` : `/designs/${item.designId}`;
}

@Injectable({ providedIn: 'root' })
export class InboxApi {
  private readonly api = inject(Api);

  /** `quiet` for background refreshes (the toolbar badge), which must not pop up errors. */
  items(quiet = false): Observable<{ items: InboxItem[] }> {
    return this.api.call(inbox, {}, quiet ? errorsShownByCaller() : {});
  }
}
