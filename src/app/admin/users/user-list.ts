import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { ROLES, type AdminUser, type Role, type UpdateUserRequest } from '@shared/schemas/auth';

import { Notifier } from '../../core/notifier';
import { ROLE_LABELS } from '../../core/roles';
import { UserCreateForm } from './user-create-form';
import { UsersApi } from './users-api';
import { bindTableSource } from '../../core/table-binding';

@Component({
  selector: 'gw-user-list',
  imports: [
    DatePipe,
    MatButtonModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
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
  protected readonly columns = ['username', 'displayName', 'email', 'role', 'status', 'lastSignInAt', 'actions'];
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
