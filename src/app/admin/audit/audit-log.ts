import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, signal } from '@angular/core';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { auditPage } from '@shared/api/audit';

import { endpointResource } from '../../core/api';

const FIRST_PAGE_SIZE = 25;

@Component({
  selector: 'gw-audit-log',
  imports: [DatePipe, MatPaginatorModule, MatProgressBarModule, MatTableModule],
  templateUrl: './audit-log.html',
  styleUrl: './audit-log.scss',
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
  protected readonly columns = ['at', 'actor', 'action', 'target', 'details'];

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }
}
