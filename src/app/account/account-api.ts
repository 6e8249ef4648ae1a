import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { changePasswordRequestSchema, type ChangePasswordRequest } from '@shared/schemas/auth';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  /** Failures come back to the form, which shows them under the fields. */
  changePassword(request: ChangePasswordRequest): Observable<void> {
    return this.http.post<void>(
      '/api/account/password',
      changePasswordRequestSchema.parse(request),
      errorsShownByCaller(),
    );
  }
}
