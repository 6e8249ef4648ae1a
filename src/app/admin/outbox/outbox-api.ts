import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

export interface CapturedMessage {
  id: number;
  receivedAt: string;
  from: string | null;
  to: string;
  subject: string;
  text: string;
  attachments: { index: number; fileName: string; contentType: string; size: number }[];
}

export interface MailDelivery {
  id: number;
  orderId: number | null;
  recipient: string;
  subject: string;
  status: 'pending' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  list(): Observable<{ messages: CapturedMessage[]; deliveries: MailDelivery[] }> {
    return this.http.get<{ messages: CapturedMessage[]; deliveries: MailDelivery[] }>('/api/admin/outbox');
  }

  attachmentUrl(messageId: number, index: number): string {
    return `/api/admin/outbox/${messageId}/attachments/${index}`;
  }
}
