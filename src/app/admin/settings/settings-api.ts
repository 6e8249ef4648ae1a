import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ShopSettings } from '@shared/schemas/review';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../../core/error-display';

@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly http = inject(HttpClient);

  get(): Observable<ShopSettings> {
    return this.http.get<ShopSettings>('/api/admin/settings');
  }

  /** Failures come back to the form, which shows them under the field. */
  save(settings: ShopSettings): Observable<ShopSettings> {
    return this.http.put<ShopSettings>('/api/admin/settings', settings, errorsShownByCaller());
  }
}
