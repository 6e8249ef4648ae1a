import { Injectable, inject } from '@angular/core';
import { createUser, listUsers, updateUser } from '@shared/api/users';
import type { AdminUser, CreateUserRequest, UpdateUserRequest } from '@shared/schemas/auth';
import { map, type Observable } from 'rxjs';

import { Api, endpointResource } from '../../core/api';
import { errorsShownByCaller } from '../../core/error-display';

@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly api = inject(Api);

  /** Call from an injection context (a field initialiser); the list reloads with `reload()`. */
  listResource() {
    return endpointResource(listUsers, () => ({}), { select: (answer) => answer.users, defaultValue: [] });
  }

  /** Failures come back to the form, which shows them under the fields. */
  create(request: CreateUserRequest): Observable<AdminUser> {
    return this.api.call(createUser, { body: request }, errorsShownByCaller()).pipe(map(({ user }) => user));
  }

  update(id: number, change: UpdateUserRequest): Observable<AdminUser> {
    return this.api.call(updateUser, { params: { id: String(id) }, body: change }).pipe(map(({ user }) => user));
  }
}
