import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { evaluate, operatingPoint, search } from '@shared/api/calc';
import { listMaterials } from '@shared/api/materials';
import type { CoreMaterial } from '@shared/engine/index';
import type { EvaluateAnswer, OperatingPointAnswer, SearchAnswer } from '@shared/schemas/calc-answers';
import type {
  Construction,
  DesignDetail,
  DesignListResponse,
  DesignSpec,
  ExportKind,
  RevisionDetail,
  RevisionDiff,
} from '@shared/schemas/designs';
import type { Observable } from 'rxjs';
import { map } from 'rxjs';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

export interface DesignListParams {
  scope: 'mine' | 'all';
  q: string;
  sort: string;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export type MaterialView = CoreMaterial & { retired?: boolean };

@Injectable({ providedIn: 'root' })
export class DesignsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(Api);

  list(params: DesignListParams): Observable<DesignListResponse> {
    let query = new HttpParams();
    for (const [key, value] of Object.entries(params)) if (value !== '') query = query.set(key, String(value));
    return this.http.get<DesignListResponse>('/api/designs', { params: query });
  }

  get(id: number): Observable<DesignDetail> {
    return this.http.get<DesignDetail>(`/api/designs/${id}`);
  }

  create(title: string, spec: DesignSpec, construction: Construction | null): Observable<DesignDetail> {
    return this.http.post<DesignDetail>('/api/designs', { title, spec, ...(construction ? { construction } : {}) }, errorsShownByCaller());
  }

  update(id: number, revision: number, change: { title?: string; spec?: DesignSpec; construction?: Construction | null }): Observable<RevisionDetail> {
    return this.http.patch<RevisionDetail>(`/api/designs/${id}/revisions/${revision}`, change, errorsShownByCaller());
  }

  newRevision(id: number): Observable<RevisionDetail> {
    return this.http.post<RevisionDetail>(`/api/designs/${id}/revisions`, {});
  }

  copy(id: number): Observable<DesignDetail> {
    return this.http.post<DesignDetail>(`/api/designs/${id}/copy`, {});
  }

  diff(id: number, from: number, to: number): Observable<RevisionDiff> {
    return this.http.get<RevisionDiff>(`/api/designs/${id}/diff`, { params: { from, to } });
  }

  materials(): Observable<MaterialView[]> {
    return this.api.call(listMaterials, { query: {} }).pipe(map((answer) => answer.materials));
  }

  operatingPoint(spec: DesignSpec): Observable<OperatingPointAnswer> {
    const tolerance = spec.limits?.inductanceTolerance;
    return this.api.call(operatingPoint, { body: { ...spec.converter, ...(tolerance !== undefined ? { inductanceTolerance: tolerance } : {}) } }, errorsShownByCaller());
  }

  search(spec: DesignSpec, materialIds: string[]): Observable<SearchAnswer> {
    const families = spec.families?.length ? spec.families : undefined;
    return this.api.call(search, { body: { spec: spec.converter, limits: spec.limits, families, materialIds, limit: 50 } }, errorsShownByCaller());
  }

  evaluate(spec: DesignSpec, construction: Construction): Observable<EvaluateAnswer> {
    return this.api.call(evaluate, { query: { sweep: 'frequency' }, body: { spec: spec.converter, limits: spec.limits, ...construction } }, errorsShownByCaller());
  }

  exportUrl(id: number, revision: number, kind: ExportKind): string {
    return `/api/designs/${id}/revisions/${revision}/exports/${kind}`;
  }
}
