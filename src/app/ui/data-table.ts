import { DatePipe, NgTemplateOutlet } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  Directive,
  TemplateRef,
  computed,
  contentChildren,
  inject,
  input,
  output,
} from '@angular/core';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule, type MatTableDataSource } from '@angular/material/table';

import { LoadState } from './load-state';

/** One column of a `gw-data-table`. */
export interface TableColumn<T> {
  name: string;
  header: string;
  /** A sort header; `sortBy` names the sort key when it is not the column's name. */
  sortable?: boolean;
  sortBy?: string;
  /** The cell's text when the page gives no `gwCell` template for the column; null or undefined shows `absent`. */
  text?: (row: T) => string | number | null | undefined;
  /** The text is an ISO date-time, shown as a medium date. */
  date?: boolean;
  /** What an absent value shows (default "—"). */
  absent?: string;
}

/** Paging done by the server: the table shows a paginator and says when another page is asked for. */
export interface ServerPage {
  index: number;
  size: number;
  total: number;
  sizes: number[];
  /** The paginator's accessible name, e.g. "Pages of designs". */
  label: string;
}

/** The cell of one column written by the page: `<ng-template gwCell="role" let-user>…</ng-template>`. */
@Directive({ selector: 'ng-template[gwCell]' })
export class DataTableCell {
  readonly column = input.required<string>({ alias: 'gwCell' });
  readonly template = inject<TemplateRef<{ $implicit: unknown }>>(TemplateRef);
}

/**
 * A Material table in its scrolling region with a hidden caption, a header row, a row per item, a line for no
 * items and, for server-paged lists, a paginator; above it the loading bar and the failure of the list's request.
 * Columns are text from the page's column list unless the page writes their cell (`gwCell`). Put `matSort` (and
 * its inputs and events) on `<gw-data-table>` for sort headers.
 */
@Component({
  selector: 'gw-data-table',
  imports: [DatePipe, LoadState, MatPaginatorModule, MatSortModule, MatTableModule, NgTemplateOutlet],
  template: `
    @if (loadingLabel(); as what) {
      <gw-load-state [loading]="loading()" [loadingLabel]="what" [failure]="failure()" />
    }
    <div class="gw-table-scroll" role="region" [attr.aria-label]="label() + ', scrollable'" tabindex="0">
      <table mat-table [dataSource]="rows()" [attr.data-testid]="testId()">
        <caption class="gw-visually-hidden">
          {{
            caption() ?? label()
          }}
        </caption>
        @for (column of columns(); track column.name) {
          <ng-container [matColumnDef]="column.name">
            @if (column.sortable) {
              <th mat-header-cell *matHeaderCellDef [mat-sort-header]="column.sortBy ?? ''">{{ column.header }}</th>
            } @else {
              <th mat-header-cell *matHeaderCellDef>{{ column.header }}</th>
            }
            <td mat-cell *matCellDef="let row">
              @if (cells().get(column.name); as cell) {
                <ng-container *ngTemplateOutlet="cell; context: { $implicit: row }" />
              } @else if (column.date) {
                {{ (column.text?.(row) | date: 'medium') ?? column.absent ?? '—' }}
              } @else {
                {{ column.text?.(row) ?? column.absent ?? '—' }}
              }
            </td>
          </ng-container>
        }
        <tr mat-header-row *matHeaderRowDef="names()"></tr>
        <tr mat-row *matRowDef="let row; columns: names()"></tr>
        @if (loading() || empty()) {
          <tr class="mat-mdc-row gw-no-data" *matNoDataRow>
            <td class="mat-mdc-cell" [attr.colspan]="names().length">{{ loading() ? loadingLabel() + '…' : empty() }}</td>
          </tr>
        }
      </table>
    </div>
    @if (page(); as p) {
      <mat-paginator
        [length]="p.total"
        [pageIndex]="p.index"
        [pageSize]="p.size"
        [pageSizeOptions]="p.sizes"
        showFirstLastButtons
        [attr.aria-label]="p.label"
        (page)="paged.emit($event)"
      />
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .gw-table-scroll {
      overflow-x: auto;
    }
    .gw-no-data td {
      padding: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DataTable<T> {
  /** The region's accessible name; ", scrollable" is added. */
  readonly label = input.required<string>();
  /** The hidden caption, when it says more than the label. */
  readonly caption = input<string | null>(null);
  readonly columns = input.required<readonly TableColumn<T>[]>();
  readonly rows = input.required<readonly T[] | MatTableDataSource<T>>();
  /** The line shown when there are no rows (or none passes the filter; none when null); while loading it says what is loading. */
  readonly empty = input<string | null>(null);
  /** The list is being fetched: a bar above the table, named by `loadingLabel` ("Loading users"). */
  readonly loading = input(false);
  readonly loadingLabel = input<string | null>(null);
  /** Why the list could not be fetched, shown above the table. */
  readonly failure = input<string | null>(null);
  readonly testId = input<string | null>(null);
  readonly page = input<ServerPage | null>(null);
  readonly paged = output<PageEvent>();

  private readonly cellTemplates = contentChildren(DataTableCell);
  protected readonly cells = computed(() => new Map(this.cellTemplates().map((cell) => [cell.column(), cell.template])));
  protected readonly names = computed(() => this.columns().map((column) => column.name));
}
