import { HttpClient, httpResource } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ImportDecision, ImportPreview, LibraryMaterial, MaterialEdit } from '@shared/schemas/materials';
import { map, type Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';
import { uploadCsv, type UploadStep } from '../core/upload-steps';

export type { LibraryMaterial } from '@shared/schemas/materials';

export interface MaterialImportEntry {
  id: number;
  fileName: string;
  uploadedBy: string | null;
  uploadedAt: string;
  rowCount: number;
  createdCount: number;
  versionedCount: number;
  skippedCount: number;
}

export interface CommitResult {
  importId: number;
  created: number;
  versioned: number;
  skipped: number;
  materialIds: number[];
}

@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);

  listResource() {
    return httpResource(() => '/api/materials/library', {
      parse: (body) => (body as { materials: LibraryMaterial[] }).materials,
      defaultValue: [] as LibraryMaterial[],
    });
  }

  importsResource() {
    return httpResource(() => '/api/materials/imports', {
      parse: (body) => (body as { imports: MaterialImportEntry[] }).imports,
      defaultValue: [] as MaterialImportEntry[],
    });
  }

  /** Every row of a material CSV file with its status and problems; nothing is written. */
  preview(file: File): Observable<UploadStep<ImportPreview>> {
    return uploadCsv<ImportPreview>(this.http, '/api/materials/import/preview', file);
  }

  /** All rows or none; `decisions` says what to do with each name that already exists. */
  commit(file: File, decisions: Record<string, ImportDecision>): Observable<UploadStep<CommitResult>> {
    return uploadCsv<CommitResult>(this.http, '/api/materials/import/commit', file, decisions);
  }

  history(id: string): Observable<LibraryMaterial[]> {
    return this.http.get<{ versions: LibraryMaterial[] }>(`/api/materials/${id}/history`).pipe(map((body) => body.versions));
  }

  /** Changed cells only (CSV columns, in the material's unit set); the answer is the new version. */
  edit(id: string, cells: MaterialEdit): Observable<LibraryMaterial> {
    return this.http.patch<LibraryMaterial>(`/api/materials/${id}`, cells, errorsShownByCaller());
  }

  setRetired(id: string, retired: boolean): Observable<LibraryMaterial> {
    return this.http.post<LibraryMaterial>(`/api/materials/${id}/${retired ? 'retire' : 'unretire'}`, {});
  }
}
