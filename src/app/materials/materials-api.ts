import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { AnswerOf } from '@shared/api/endpoint';
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
import type { ImportDecision, LibraryMaterial, MaterialEdit } from '@shared/schemas/materials';
import { map, type Observable } from 'rxjs';

import { Api, endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { uploadToEndpoint, type UploadStep } from '../core/upload-steps';

export type { LibraryMaterial } from '@shared/schemas/materials';
export type { MaterialCommitResult as CommitResult } from '@shared/schemas/materials';

@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(Api);

  listResource() {
    return endpointResource(materialLibrary, () => ({}), { select: (answer) => answer.materials, defaultValue: [] });
  }

  importsResource() {
    return endpointResource(materialImports, () => ({}), { select: (answer) => answer.imports, defaultValue: [] });
  }

  /** Every row of a material CSV file with its status and problems; nothing is written. */
  preview(file: File): Observable<UploadStep<AnswerOf<typeof previewMaterialImport>>> {
    return uploadToEndpoint(this.http, previewMaterialImport, file);
  }

  /** All rows or none; `decisions` says what to do with each name that already exists. */
  commit(file: File, decisions: Record<string, ImportDecision>): Observable<UploadStep<AnswerOf<typeof commitMaterialImport>>> {
    return uploadToEndpoint(this.http, commitMaterialImport, file, decisions);
  }

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
