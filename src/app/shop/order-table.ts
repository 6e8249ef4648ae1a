import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, viewChild } from '@angular/core';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { OrderSummary } from '@shared/schemas/shop';

import { bindTableSource } from '../core/table-binding';

/** One list of build orders, sortable and paged. */
@Component({
  selector: 'gw-order-table',
  imports: [DatePipe, MatPaginatorModule, MatSortModule, MatTableModule, RouterLink],
  template: `
    <div class="gw-table-scroll" role="region" [attr.aria-label]="caption() + ', scrollable'" tabindex="0">
      <table mat-table [dataSource]="dataSource" matSort matSortActive="createdAt" matSortDirection="desc">
        <caption class="gw-visually-hidden">
          {{
            caption()
          }}
        </caption>
        <ng-container matColumnDef="number">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Order</th>
          <td mat-cell *matCellDef="let order" class="gw-nowrap">
            <a [routerLink]="['/shop/orders', order.id]">{{ order.number }}</a>
          </td>
        </ng-container>
        <ng-container matColumnDef="designNumber">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Design</th>
          <td mat-cell *matCellDef="let order">{{ order.designNumber }} rev {{ order.revision }}</td>
        </ng-container>
        <ng-container matColumnDef="title">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Title</th>
          <td mat-cell *matCellDef="let order">{{ order.title }}</td>
        </ng-container>
        <ng-container matColumnDef="progress">
          <th mat-header-cell *matHeaderCellDef mat-sort-header="passed">Passed / quantity</th>
          <td mat-cell *matCellDef="let order">{{ order.passed }} / {{ order.quantity }} ({{ order.built }} built)</td>
        </ng-container>
        <ng-container matColumnDef="createdAt">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Released</th>
          <td mat-cell *matCellDef="let order">{{ order.createdAt | date: 'medium' }}</td>
        </ng-container>
        <ng-container matColumnDef="completedAt">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Completed</th>
          <td mat-cell *matCellDef="let order">{{ order.completedAt ? (order.completedAt | date: 'medium') : '—' }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row gw-no-data" *matNoDataRow>
          <td class="mat-mdc-cell" [attr.colspan]="columns.length">{{ empty() }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [pageSizeOptions]="[10, 25, 50]" [pageSize]="25" [attr.aria-label]="'Pages of ' + caption()" />
  `,
  styles: `
    .gw-nowrap {
      white-space: nowrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderTable {
  readonly orders = input.required<OrderSummary[]>();
  readonly caption = input.required<string>();
  readonly empty = input('No build orders.');

  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);
  protected readonly columns = ['number', 'designNumber', 'title', 'progress', 'createdAt', 'completedAt'];
  protected readonly dataSource = new MatTableDataSource<OrderSummary>([]);

  constructor() {
    bindTableSource(this.dataSource, () => this.orders(), this.sort, this.paginator);
  }
}
