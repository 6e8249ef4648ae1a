import { Injectable, inject } from '@angular/core';
import { changePassword } from '@shared/api/account';
import type { ChangePasswordRequest } from '@shared/schemas/auth';
import type { Observable } from 'rxjs';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly api = inject(Api);

  /** Failures come back to the form, which shows them under the fields. */
  changePassword(request: ChangePasswordRequest): Observable<void> {
    return this.api.call(changePassword, { body: request }, errorsShownByCaller());
  }
}
