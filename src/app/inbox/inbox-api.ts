import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

export interface InboxItem {
  kind: 'review' | 'release' | 'returned' | 'build' | string;
  label: string;
  designId: number;
  revisionId?: number;
  orderId?: number;
  since: string;
}

/** Where an inbox item leads: a build order for the shop, otherwise the design. */
export function inboxLink(item: InboxItem): string {
  return item.kind === 'build' && item.orderId !== undefined ? `/shop/orders/${item.orderId}` : `/designs/${item.designId}`;
}

@Injectable({ providedIn: 'root' })
export class InboxApi {
  private readonly http = inject(HttpClient);

  /** `quiet` for background refreshes (the toolbar badge), which must not pop up errors. */
  items(quiet = false): Observable<{ items: InboxItem[] }> {
    return this.http.get<{ items: InboxItem[] }>('/api/inbox', quiet ? errorsShownByCaller() : {});
  }
}
