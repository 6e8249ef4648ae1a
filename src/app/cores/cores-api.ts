import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import {
  commitCoreImport,
  createUserCore,
  editUserCore,
  listCores,
  previewCoreImport,
  retireUserCore,
  unretireUserCore,
  userCoreHistory,
} from '@shared/api/catalogue';
import type { ListedCore, UserCoreRequest } from '@shared/schemas/cores';
import { map, type Observable } from 'rxjs';

import { Api, endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { csvImportCalls } from '../core/upload-steps';

/** A core as the catalogue lists it (shared with the server's listing). */
export type CatalogueCore = ListedCore;

/** What an import of a core CSV file did. */
export type { CoreImportResult } from '@shared/schemas/cores';

@Injectable({ providedIn: 'root' })
export class CoresApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(Api);

  listResource() {
    return endpointResource(listCores, () => ({}), { select: (answer) => answer.cores, defaultValue: [] });
  }

  /** Every version of a user core, newest first. */
  history(userCoreId: number): Observable<CatalogueCore[]> {
    return this.api.call(userCoreHistory, { params: { id: String(userCoreId) } }).pipe(map((answer) => answer.versions));
  }

  /** Retired user cores leave new searches; designs that use them keep them. */
  setRetired(userCoreId: number, retired: boolean): Observable<CatalogueCore> {
    return this.api.call(retired ? retireUserCore : unretireUserCore, { params: { id: String(userCoreId) } });
  }

  /** A new version of a user core (its current version's id). */
  edit(userCoreId: number, request: UserCoreRequest): Observable<CatalogueCore> {
    return this.api.call(editUserCore, { params: { id: String(userCoreId) }, body: request }, errorsShownByCaller());
  }

  create(request: UserCoreRequest): Observable<CatalogueCore> {
    return this.api.call(createUserCore, { body: request }, errorsShownByCaller());
  }

  /** Every row of a CSV file with its status and problems (nothing written), then all rows or none with a decision per existing name. */
  readonly csvImport = csvImportCalls(this.http, previewCoreImport, commitCoreImport);
}
