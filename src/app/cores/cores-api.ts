import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ImportDecision, ImportPreview } from '@shared/schemas/core-csv';
import type { ListedCore, UserCoreRequest } from '@shared/schemas/cores';
import { listCores } from '@shared/api/catalogue';
import { map, type Observable } from 'rxjs';

import { endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { uploadCsv, type UploadStep } from '../core/upload-steps';

/** A core as the catalogue lists it (shared with the server's listing). */
export type CatalogueCore = ListedCore;

/** What an import of a core CSV file did. */
export interface CoreImportResult {
  fileName: string;
  created: number;
  versioned: number;
  skipped: number;
  coreIds: number[];
}

@Injectable({ providedIn: 'root' })
export class CoresApi {
  private readonly http = inject(HttpClient);

  listResource() {
    return endpointResource(listCores, () => ({}), { select: (answer) => answer.cores, defaultValue: [] });
  }

  /** Every version of a user core, newest first. */
  history(userCoreId: number): Observable<CatalogueCore[]> {
    return this.http.get<{ versions: CatalogueCore[] }>(`/api/catalogue/cores/${userCoreId}/history`).pipe(map((body) => body.versions));
  }

  /** Retired user cores leave new searches; designs that use them keep them. */
  setRetired(userCoreId: number, retired: boolean): Observable<CatalogueCore> {
    return this.http.post<CatalogueCore>(`/api/catalogue/cores/${userCoreId}/${retired ? 'retire' : 'unretire'}`, {});
  }

  /** A new version of a user core (its current version's id). */
  edit(userCoreId: number, request: UserCoreRequest): Observable<CatalogueCore> {
    return this.http.put<CatalogueCore>(`/api/catalogue/cores/${userCoreId}`, request, errorsShownByCaller());
  }

  create(request: UserCoreRequest): Observable<CatalogueCore> {
    return this.http.post<CatalogueCore>('/api/catalogue/cores', request, errorsShownByCaller());
  }

  /** Every row of a core CSV file with its status and problems; nothing is written. */
  previewImport(file: File): Observable<UploadStep<ImportPreview>> {
    return uploadCsv<ImportPreview>(this.http, '/api/catalogue/cores/import/preview', file);
  }

  /** All rows or none; `decisions` says what to do with each name that already exists. */
  commitImport(file: File, decisions: Record<string, ImportDecision>): Observable<UploadStep<CoreImportResult>> {
    return uploadCsv<CoreImportResult>(this.http, '/api/catalogue/cores/import/commit', file, decisions);
  }
}
