import { HttpClient, httpResource } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { UserCoreRequest } from '@shared/schemas/cores';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

export interface CatalogueCore {
  id: string;
  family: string;
  gapKind: string;
  ae: number;
  le: number;
  ve: number;
  windowArea: number;
  areaProduct: number;
  source: string;
  origin: 'shipped' | 'user';
  userCoreId?: number;
  version?: number;
  retired?: boolean;
  createdBy?: string | null;
}

@Injectable({ providedIn: 'root' })
export class CoresApi {
  private readonly http = inject(HttpClient);

  listResource() {
    return httpResource(() => '/api/catalogue/cores', {
      parse: (body) => (body as { cores: CatalogueCore[] }).cores,
      defaultValue: [] as CatalogueCore[],
    });
  }

  create(request: UserCoreRequest): Observable<CatalogueCore> {
    return this.http.post<CatalogueCore>('/api/catalogue/cores', request, errorsShownByCaller());
  }
}
