import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { PageEvent } from '@angular/material/paginator';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { Router, RouterLink } from '@angular/router';
import { may } from '@shared/api/permissions';
import { DESIGN_SORT_KEYS, type DesignListItem, type DesignListResponse, type DesignSortKey } from '@shared/schemas/designs';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';

import { Notifier } from '../core/notifier';
import { Session } from '../core/session';
import { DataTable, DataTableCell, type TableColumn } from '../ui/data-table';
import { DesignsApi, type DesignListParams } from './designs-api';
import { STATUS_LABELS } from './format';
import { DesignImport } from './design-import';

const sortKey = (column: string): DesignSortKey => DESIGN_SORT_KEYS.find((key) => key === column) ?? 'updated';

/** Every design, paged, sorted and searched on the server. */
@Component({
  selector: 'gw-design-list',
  imports: [
    DesignImport,
    DataTable,
    DataTableCell,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatSortModule,
  ],
  templateUrl: './design-list.html',
  styleUrl: './design-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignList {
  private readonly api = inject(DesignsApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);

  protected readonly params = signal<DesignListParams>({ scope: 'all', q: '', sort: 'updated', dir: 'desc', page: 0, pageSize: 20 });
  protected readonly canDesign = computed(() => may(this.session.role(), 'design'));
  protected readonly columns: TableColumn<DesignListItem>[] = [
    { name: 'number', header: 'Number', sortable: true },
    { name: 'title', header: 'Title', sortable: true, text: (d) => d.title },
    { name: 'summary', header: 'Converter', text: (d) => d.summary },
    { name: 'status', header: 'Status', sortable: true, text: (d) => `${STATUS_LABELS[d.status]} (rev. ${d.revision})` },
    { name: 'owner', header: 'Owner', sortable: true, text: (d) => d.owner.displayName },
    { name: 'updated', header: 'Updated', sortable: true, text: (d) => d.updatedAt, date: true },
    { name: 'actions', header: 'Actions' },
  ];

  private readonly response = toSignal(
    toObservable(this.params).pipe(
      debounceTime(150),
      switchMap((params) =>
        this.api.list(params).pipe(
          map((body) => ({ loading: false, body, failed: false })),
          catchError(() => of({ loading: false, body: null as DesignListResponse | null, failed: true })),
          startWith({ loading: true, body: null as DesignListResponse | null, failed: false }),
        ),
      ),
    ),
    { initialValue: { loading: true, body: null, failed: false } },
  );
  private lastItems: DesignListItem[] = [];
  protected readonly loading = computed(() => this.response().loading);
  protected readonly failed = computed(() => this.response().failed);
  protected readonly items = computed(() => {
    const body = this.response().body;
    if (body) this.lastItems = body.items;
    return body?.items ?? this.lastItems;
  });
  protected readonly total = computed(() => this.response().body?.total ?? 0);

  protected search(q: string): void {
    this.params.update((p) => ({ ...p, q, page: 0 }));
  }

  protected scope(scope: 'mine' | 'all'): void {
    this.params.update((p) => ({ ...p, scope, page: 0 }));
  }

  protected sorted(sort: Sort): void {
    this.params.update((p) => ({ ...p, sort: sort.direction ? sortKey(sort.active) : 'updated', dir: sort.direction || 'desc', page: 0 }));
  }

  protected paged(event: PageEvent): void {
    this.params.update((p) => ({ ...p, page: event.pageIndex, pageSize: event.pageSize }));
  }

  protected copy(item: DesignListItem): void {
    this.api.copy(item.id).subscribe((created) => {
      this.notifier.info(`Copied ${item.number} to ${created.number}.`);
      void this.router.navigate(['/designs', created.id]);
    });
  }
}
