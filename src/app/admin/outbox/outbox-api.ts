import { Injectable, inject } from '@angular/core';
import { outbox, outboxAttachment } from '@shared/api/outbox';
import { endpointUrl } from '@shared/api/endpoint';
import type { OutboxResponse } from '@shared/schemas/outbox';
import type { Observable } from 'rxjs';

import { Api } from '../../core/api';

@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly api = inject(Api);

  list(): Observable<OutboxResponse> {
    return this.api.call(outbox, {});
  }

  attachmentUrl(messageId: number, index: number): string {
    return endpointUrl(outboxAttachment, { id: messageId, index });
  }
}
