import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import type { CapturedMessage, MailDelivery } from '@shared/schemas/outbox';

import { DataTable, DataTableCell, type TableColumn } from '../../ui/data-table';
import { LoadState } from '../../ui/load-state';
import { OutboxApi } from './outbox-api';

/** Mail the app tried to send (delivery states, retries) and what the local fake SMTP server caught. */
@Component({
  selector: 'gw-outbox',
  imports: [DataTable, DataTableCell, DatePipe, DecimalPipe, LoadState, MatButtonModule, MatExpansionModule, MatIconModule],
  templateUrl: './outbox.html',
  styles: `
    .gw-mail-text {
      white-space: pre-wrap;
      font: var(--mat-sys-body-medium);
      max-width: 90ch;
    }
    .gw-attachments {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .gw-failed {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
    .gw-panel-meta {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox {
  private readonly api = inject(OutboxApi);
  protected readonly messages = signal<CapturedMessage[]>([]);
  protected readonly deliveries = signal<MailDelivery[]>([]);
  protected readonly loading = signal(true);
  protected readonly deliveryColumns: TableColumn<MailDelivery>[] = [
    { name: 'createdAt', header: 'Queued', text: (d) => d.createdAt, date: true },
    { name: 'recipient', header: 'To', text: (d) => d.recipient },
    { name: 'subject', header: 'Subject', text: (d) => d.subject },
    { name: 'status', header: 'State' },
    { name: 'attempts', header: 'Attempts', text: (d) => d.attempts },
    { name: 'lastError', header: 'Last error', text: (d) => d.lastError },
  ];

  constructor() {
    this.reload();
  }

  protected reload(): void {
    this.loading.set(true);
    this.api.list().subscribe({
      next: ({ messages, deliveries }) => {
        this.messages.set(messages);
        this.deliveries.set(deliveries);
        this.loading.set(false);
      },
      error: () => this.loading.set(false),
    });
  }

  protected attachmentUrl(message: CapturedMessage, index: number): string {
    return this.api.attachmentUrl(message.id, index);
  }
}
