import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource } from '@angular/material/table';
import { ROLES, type AdminUser, type Role, type UpdateUserRequest } from '@shared/schemas/auth';

import { Notifier } from '../../core/notifier';
import { ROLE_LABELS } from '../../core/roles';
import { UserCreateForm } from './user-create-form';
import { bindTableSource } from '../../core/table-binding';
import { DataTable, DataTableCell, type TableColumn } from '../../ui/data-table';
import { UsersApi } from './users-api';

@Component({
  selector: 'gw-user-list',
  imports: [
    DataTable,
    DataTableCell,
    MatButtonModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    UserCreateForm,
  ],
  templateUrl: './user-list.html',
  styleUrl: './user-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly usersApi = inject(UsersApi);
  private readonly notifier = inject(Notifier);
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);

  protected readonly users = this.usersApi.listResource();
  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly columns: TableColumn<AdminUser>[] = [
    { name: 'username', header: 'Username', sortable: true, text: (user) => user.username },
    { name: 'displayName', header: 'Display name', sortable: true, text: (user) => user.displayName },
    { name: 'email', header: 'E-mail', sortable: true, text: (user) => user.email },
    { name: 'role', header: 'Role', sortable: true },
    { name: 'status', header: 'Status', sortable: true, sortBy: 'disabled', text: (user) => (user.disabled ? 'Disabled' : 'Active') },
    { name: 'lastSignInAt', header: 'Last sign-in', sortable: true, text: (user) => user.lastSignInAt, date: true, absent: 'Never' },
    { name: 'actions', header: 'Actions' },
  ];
  protected readonly dataSource = new MatTableDataSource<AdminUser>([]);
  protected readonly filterText = signal('');

  constructor() {
    this.dataSource.filterPredicate = (user, filter) =>
      [user.username, user.displayName, user.email ?? '', ROLE_LABELS[user.role], user.disabled ? 'disabled' : 'active']
        .join(' ')
        .toLowerCase()
        .includes(filter);
    bindTableSource(this.dataSource, () => this.users.value(), this.sort, this.paginator);
  }

  protected applyFilter(text: string): void {
    this.filterText.set(text);
    this.dataSource.filter = text.trim().toLowerCase();
    this.dataSource.paginator?.firstPage();
  }

  protected addCreated(user: AdminUser): void {
    this.users.update((list) => [...list, user]);
    this.notifier.info(`User ${user.username} created.`);
  }

  protected changeRole(user: AdminUser, role: Role): void {
    if (role !== user.role) this.save(user, { role });
  }

  protected toggleDisabled(user: AdminUser): void {
    this.save(user, { disabled: !user.disabled });
  }

  private save(user: AdminUser, change: UpdateUserRequest): void {
    this.usersApi.update(user.id, change).subscribe({
      next: (updated) => {
        this.users.update((list) => list.map((each) => (each.id === updated.id ? updated : each)));
        this.notifier.info(`User ${updated.username} updated.`);
      },
      // The interceptor has told the person why; put the row back as the server has it.
      error: () => this.users.reload(),
    });
  }
}
