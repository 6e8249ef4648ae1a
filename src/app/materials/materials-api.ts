import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import {
  commitMaterialImport,
  editMaterial,
  materialHistory,
  materialImports,
  materialLibrary,
  previewMaterialImport,
  retireMaterial,
  unretireMaterial,
} from '@shared/api/materials';
import type { LibraryMaterial } from '@shared/schemas/material-answers';
import type { MaterialEdit } from '@shared/schemas/material-requests';
import { map, type Observable } from 'rxjs';

import { Api, endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { csvImportCalls } from '../core/upload-steps';

export type { LibraryMaterial, MaterialCommitResult as CommitResult } from '@shared/schemas/material-answers';

@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(Api);

  /** The library and whether this user may upload material files. */
  libraryResource() {
    return endpointResource(materialLibrary, () => ({}), { select: (answer) => answer, defaultValue: { materials: [], canImport: false } });
  }

  importsResource() {
    return endpointResource(materialImports, () => ({}), { select: (answer) => answer.imports, defaultValue: [] });
  }

  /** Every row of a CSV file with its status and problems (nothing written), then all rows or none with a decision per existing name. */
  readonly csvImport = csvImportCalls(this.http, previewMaterialImport, commitMaterialImport);

  history(id: string): Observable<LibraryMaterial[]> {
    return this.api.call(materialHistory, { params: { id } }).pipe(map((answer) => answer.versions));
  }

  /** Changed cells only (CSV columns, in the material's unit set); the answer is the new version. */
  edit(id: string, cells: MaterialEdit): Observable<LibraryMaterial> {
    return this.api.call(editMaterial, { params: { id }, body: cells }, errorsShownByCaller());
  }

  setRetired(id: string, retired: boolean): Observable<LibraryMaterial> {
    return this.api.call(retired ? retireMaterial : unretireMaterial, { params: { id } });
  }
}
