import { ChangeDetectionStrategy, Component, computed, signal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import { auditPage } from '@shared/api/audit';
import type { AuditEntry } from '@shared/schemas/auth';

import { endpointResource } from '../../core/api';
import { DataTable, type TableColumn } from '../../ui/data-table';

const FIRST_PAGE_SIZE = 25;

@Component({
  selector: 'gw-audit-log',
  imports: [DataTable],
  templateUrl: './audit-log.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditLog {
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(FIRST_PAGE_SIZE);

  // The log grows without bound, so the server pages it; only one page is ever loaded.
  protected readonly page = endpointResource(auditPage, () => ({
    query: { offset: this.pageIndex() * this.pageSize(), limit: this.pageSize() },
  }));
  protected readonly entries = computed(() => (this.page.hasValue() ? this.page.value().entries : []));
  protected readonly total = computed(() => (this.page.hasValue() ? this.page.value().total : 0));
  protected readonly columns: TableColumn<AuditEntry>[] = [
    { name: 'at', header: 'Time', text: (entry) => entry.at, date: true },
    { name: 'actor', header: 'Actor', text: (entry) => entry.actor, absent: 'System' },
    { name: 'action', header: 'Action', text: (entry) => entry.action },
    { name: 'target', header: 'Target', text: (entry) => entry.target },
    { name: 'details', header: 'Details', text: (entry) => entry.details },
  ];

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }
}
