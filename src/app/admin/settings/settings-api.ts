import { Injectable, inject } from '@angular/core';
import { saveSettings, settings } from '@shared/api/settings';
import type { ShopSettings } from '@shared/schemas/settings';
import type { Observable } from 'rxjs';

import { Api } from '../../core/api';
import { errorsShownByCaller } from '../../core/error-display';

@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly api = inject(Api);

  get(): Observable<ShopSettings> {
    return this.api.call(settings, {});
  }

  /** Failures come back to the form, which shows them under the field. */
  save(request: ShopSettings): Observable<ShopSettings> {
    return this.api.call(saveSettings, { body: request }, errorsShownByCaller());
  }
}
