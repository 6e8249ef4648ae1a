import { effect } from '@angular/core';
import type { MatPaginator } from '@angular/material/paginator';
import type { MatSort } from '@angular/material/sort';
import type { MatTableDataSource } from '@angular/material/table';

/**
 * Keeps a client-side table's data source in step with its rows, sort header and paginator.
 * Call from a constructor (it creates effects).
 */
export function bindTableSource<T>(
  dataSource: MatTableDataSource<T>,
  rows: () => T[],
  sort: () => MatSort | undefined,
  paginator: () => MatPaginator | undefined,
): void {
  effect(() => {
    dataSource.data = rows();
  });
  effect(() => {
    dataSource.sort = sort() ?? null;
    dataSource.paginator = paginator() ?? null;
  });
}
