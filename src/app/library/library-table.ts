import {
  ChangeDetectionStrategy,
  Component,
  contentChildren,
  effect,
  inject,
  input,
  viewChild,
  type AfterContentInit,
} from '@angular/core';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort } from '@angular/material/sort';
import { MatColumnDef, MatTable, MatTableDataSource, MatTableModule } from '@angular/material/table';

import { bindTableSource } from '../core/table-binding';

/**
 * A library's table (materials, cores): scrollable, sortable, filtered, paged, with a row for "nothing to
 * show". The page projects its own `matColumnDef`s and names the ones to show in `columns`.
 */
@Component({
  selector: 'gw-library-table',
  imports: [MatPaginatorModule, MatTableModule],
  templateUrl: './library-table.html',
  styleUrl: './library-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // On the host rather than on the table inside: the page's projected sort headers look for their MatSort from
  // where they are written, inside this element.
  hostDirectives: [{ directive: MatSort, inputs: ['matSortActive: sortActive'] }],
})
export class LibraryTable<T> implements AfterContentInit {
  readonly rows = input.required<T[]>();
  /** The projected columns to show, in order. */
  readonly columns = input.required<readonly string[]>();
  /** What the table holds, e.g. "Material library": its caption and, with ", scrollable", its region's name. */
  readonly label = input.required<string>();
  /** The paginator's accessible name, e.g. "Pages of materials". */
  readonly pagesLabel = input.required<string>();
  /** Shown in place of rows when there are none (or none pass the filter). */
  readonly emptyText = input.required<string>();
  /** The filter as text; a change shows the first page. */
  readonly filter = input('');
  readonly filterPredicate = input<(row: T, filter: string) => boolean>();
  readonly sortingDataAccessor = input<(row: T, column: string) => string | number>();

  protected readonly dataSource = new MatTableDataSource<T>([]);
  private readonly table = viewChild.required(MatTable);
  private readonly sort = inject(MatSort, { self: true });
  private readonly paginator = viewChild.required(MatPaginator);
  private readonly projected = contentChildren(MatColumnDef);

  constructor() {
    this.sort.direction = 'asc';
    bindTableSource(
      this.dataSource,
      () => this.rows(),
      () => this.sort,
      this.paginator,
    );
    effect(() => {
      const predicate = this.filterPredicate();
      if (predicate) this.dataSource.filterPredicate = predicate;
      const accessor = this.sortingDataAccessor();
      if (accessor) this.dataSource.sortingDataAccessor = accessor;
      this.dataSource.filter = this.filter();
      this.dataSource.paginator?.firstPage();
    });
  }

  // The table must know the page's columns before it renders a row.
  ngAfterContentInit(): void {
    for (const column of this.projected()) this.table().addColumnDef(column);
  }
}
