import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { EvaluationResult, SearchResult, WireOption, CoreMaterial } from '@shared/engine/index';
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

import { errorsShownByCaller } from '../core/error-display';

export interface DesignListParams {
  scope: 'mine' | 'all';
  q: string;
  sort: string;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export interface OperatingPointView {
  dutyAtVinMin: number;
  dutyAtVinMax: number;
  inductance: number;
  inductanceNominal: number;
  ripplePeakToPeak: number;
  rippleAtVinMin: number;
  peakCurrent: number;
  valleyCurrent: number;
  rmsCurrent: number;
  energy: number;
  saturationCheckCurrent: number;
  warnings: { code: string; severity: string; message: string }[];
}

export interface EvaluateView {
  engineVersion: string;
  wire: WireOption;
  result: EvaluationResult;
  lossVersusFrequency?: { frequency: number; copperDc: number; copperAc: number; core: number; total: number; rise: number }[];
}

export type MaterialView = CoreMaterial & { retired?: boolean };

@Injectable({ providedIn: 'root' })
export class DesignsApi {
  private readonly http = inject(HttpClient);

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
    return this.http.get<{ materials: MaterialView[] }>('/api/materials').pipe(map((body) => body.materials));
  }

  operatingPoint(spec: DesignSpec): Observable<OperatingPointView> {
    return this.http.post<OperatingPointView>(
      '/api/calc/operating-point',
      { ...spec.converter, ...(spec.limits?.inductanceTolerance !== undefined ? { inductanceTolerance: spec.limits.inductanceTolerance } : {}) },
      errorsShownByCaller(),
    );
  }

  search(spec: DesignSpec, materialIds: string[]): Observable<SearchResult> {
    return this.http.post<SearchResult>(
      '/api/calc/search',
      { spec: spec.converter, limits: spec.limits, families: spec.families?.length ? spec.families : undefined, materialIds, limit: 50 },
      errorsShownByCaller(),
    );
  }

  evaluate(spec: DesignSpec, construction: Construction): Observable<EvaluateView> {
    return this.http.post<EvaluateView>(
      '/api/calc/evaluate?sweep=frequency',
      { spec: spec.converter, limits: spec.limits, ...construction },
      errorsShownByCaller(),
    );
  }

  exportUrl(id: number, revision: number, kind: ExportKind): string {
    return `/api/designs/${id}/revisions/${revision}/exports/${kind}`;
  }
}
