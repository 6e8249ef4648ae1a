import { HttpClient, httpResource } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import {
  createUserRequestSchema,
  updateUserRequestSchema,
  userListResponseSchema,
  type CreateUserRequest,
  type UpdateUserRequest,
  type User,
} from '@shared/schemas/auth';
import { map, type Observable } from 'rxjs';

import { errorsShownByCaller } from '../../core/error-display';
import { userResponseSchema } from '../../core/session';

@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  /** Call from an injection context (a field initialiser); the list reloads with `reload()`. */
  listResource() {
    return httpResource(() => '/api/admin/users', {
      parse: (body) => userListResponseSchema.parse(body).users,
      defaultValue: [] as User[],
    });
  }

  /** Failures come back to the form, which shows them under the fields. */
  create(request: CreateUserRequest): Observable<User> {
    return this.http
      .post('/api/admin/users', createUserRequestSchema.parse(request), errorsShownByCaller())
      .pipe(map((body) => userResponseSchema.parse(body).user));
  }

  update(id: number, change: UpdateUserRequest): Observable<User> {
    return this.http
      .patch(`/api/admin/users/${id}`, updateUserRequestSchema.parse(change))
      .pipe(map((body) => userResponseSchema.parse(body).user));
  }
}
