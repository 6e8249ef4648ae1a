import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { copyDesign, createDesign, diffRevisions, getDesign, listDesigns, newRevision, updateRevision } from '@shared/api/designs';
import { exportRevision } from '@shared/api/exports';
import { endpointUrl } from '@shared/api/endpoint';
import type { EvaluationResult, SearchResult, WireOption, CoreMaterial } from '@shared/engine/index';
import type {
  Construction,
  DesignDetail,
  DesignListResponse,
  DesignSortKey,
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
  sort: DesignSortKey;
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
  private readonly api = inject(Api);

  list(params: DesignListParams): Observable<DesignListResponse> {
    return this.api.call(listDesigns, { query: { ...params, q: params.q || undefined } });
  }

  get(id: number): Observable<DesignDetail> {
    return this.api.call(getDesign, { params: { id: String(id) } });
  }

  create(title: string, spec: DesignSpec, construction: Construction | null): Observable<DesignDetail> {
    return this.api.call(createDesign, { body: { title, spec, ...(construction ? { construction } : {}) } }, errorsShownByCaller());
  }

  update(id: number, revision: number, change: { title?: string; spec?: DesignSpec; construction?: Construction | null }): Observable<RevisionDetail> {
    return this.api.call(updateRevision, { params: { id: String(id), rev: String(revision) }, body: change }, errorsShownByCaller());
  }

  newRevision(id: number): Observable<RevisionDetail> {
    return this.api.call(newRevision, { params: { id: String(id) }, body: {} });
  }

  copy(id: number): Observable<DesignDetail> {
    return this.api.call(copyDesign, { params: { id: String(id) }, body: {} });
  }

  diff(id: number, from: number, to: number): Observable<RevisionDiff> {
    return this.api.call(diffRevisions, { params: { id: String(id) }, query: { from, to } });
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
    return endpointUrl(exportRevision, { id, rev: revision, kind });
  }
}
