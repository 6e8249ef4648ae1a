import { HttpClient, HttpEventType, httpResource, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ImportDecision, ImportPreview } from '@shared/schemas/materials';
import { filter, map, type Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

export interface LibraryMaterial {
  id: string;
  name: string;
  family: string;
  lineage: string;
  version: number;
  retired: boolean;
  current: boolean;
  unitSet: string;
  kUploaded: number;
  k: number;
  alpha: number;
  beta: number;
  fitFrequencyMin: number;
  fitFrequencyMax: number;
  fitFluxMin: number;
  fitFluxMax: number;
  permeability: number;
  provenance: string;
  createdAt: string;
  createdBy: string | null;
}

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

/** Upload progress (0–100 while the file travels, null while the server checks it) or the answer. */
export type UploadStep<T> = { kind: 'progress'; percent: number | null } | { kind: 'done'; body: T };

function uploadSteps<T>(events: Observable<HttpEvent<T>>): Observable<UploadStep<T>> {
  return events.pipe(
    filter((e) => e.type === HttpEventType.UploadProgress || e.type === HttpEventType.Response),
    map((e): UploadStep<T> => {
      if (e.type === HttpEventType.Response) return { kind: 'done', body: e.body as T };
      if (e.type !== HttpEventType.UploadProgress) return { kind: 'progress', percent: null };
      const percent = e.total ? Math.round((100 * e.loaded) / e.total) : null;
      return { kind: 'progress', percent: percent !== null && percent >= 100 ? null : percent };
    }),
  );
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

  preview(file: File): Observable<UploadStep<ImportPreview>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return uploadSteps(
      this.http.post<ImportPreview>('/api/materials/import/preview', form, { ...errorsShownByCaller(), reportProgress: true, observe: 'events' }),
    );
  }

  commit(file: File, decisions: Record<string, ImportDecision>): Observable<UploadStep<CommitResult>> {
    const form = new FormData();
    form.append('decisions', JSON.stringify(decisions));
    form.append('file', file, file.name);
    return uploadSteps(
      this.http.post<CommitResult>('/api/materials/import/commit', form, { ...errorsShownByCaller(), reportProgress: true, observe: 'events' }),
    );
  }

  history(id: string): Observable<LibraryMaterial[]> {
    return this.http.get<{ versions: LibraryMaterial[] }>(`/api/materials/${id}/history`).pipe(map((body) => body.versions));
  }

  setRetired(id: string, retired: boolean): Observable<LibraryMaterial> {
    return this.http.post<LibraryMaterial>(`/api/materials/${id}/${retired ? 'retire' : 'unretire'}`, {});
  }
}
