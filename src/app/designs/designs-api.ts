import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { evaluate, operatingPoint, search } from '@shared/api/calc';
import {
  copyDesign,
  createDesign,
  diffRevisions,
  getDesign,
  importDesign,
  listDesigns,
  newRevision,
  updateRevision,
} from '@shared/api/designs';
import { endpointUrl } from '@shared/api/endpoint';
import { exportRevision } from '@shared/api/exports';
import { listMaterials } from '@shared/api/materials';
import type { CoreMaterial } from '@shared/engine/index';
import type { EvaluateAnswer, OperatingPointAnswer, SearchAnswer } from '@shared/schemas/calc-answers';
import type {
  Construction,
  DesignDetail,
  DesignFile,
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
import type { SearchQuery } from './candidate-search';

export interface DesignListParams {
  scope: 'mine' | 'all';
  q: string;
  sort: DesignSortKey;
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
    return this.api.call(listDesigns, { query: { ...params, q: params.q || undefined } });
  }

  get(id: number): Observable<DesignDetail> {
    return this.api.call(getDesign, { params: { id: String(id) } });
  }

  create(title: string, spec: DesignSpec, construction: Construction | null): Observable<DesignDetail> {
    return this.api.call(createDesign, { body: { title, spec, ...(construction ? { construction } : {}) } }, errorsShownByCaller());
  }

  update(
    id: number,
    revision: number,
    change: { title?: string; spec?: DesignSpec; construction?: Construction | null },
  ): Observable<RevisionDetail> {
    return this.api.call(updateRevision, { params: { id: String(id), rev: String(revision) }, body: change }, errorsShownByCaller());
  }

  newRevision(id: number): Observable<RevisionDetail> {
    return this.api.call(newRevision, { params: { id: String(id) }, body: {} });
  }

  copy(id: number): Observable<DesignDetail> {
    return this.api.call(copyDesign, { params: { id: String(id) }, body: {} });
  }

  /** A new design from an exported design file; the caller shows a refusal beside the file. */
  importFile(file: DesignFile): Observable<DesignDetail> {
    return this.api.call(importDesign, { body: file }, errorsShownByCaller());
  }

  diff(id: number, from: number, to: number): Observable<RevisionDiff> {
    return this.api.call(diffRevisions, { params: { id: String(id) }, query: { from, to } });
  }

  materials(): Observable<MaterialView[]> {
    return this.api.call(listMaterials, { query: {} }).pipe(map((answer) => answer.materials));
  }

  operatingPoint(spec: DesignSpec): Observable<OperatingPointAnswer> {
    const tolerance = spec.limits?.inductanceTolerance;
    return this.api.call(
      operatingPoint,
      { body: { ...spec.converter, ...(tolerance !== undefined ? { inductanceTolerance: tolerance } : {}) } },
      errorsShownByCaller(),
    );
  }

  /** One page of the ranked candidates: the server ranks by the objective and pages through every candidate. */
  search(query: SearchQuery): Observable<SearchAnswer> {
    const { spec, materialIds, rankBy, offset, limit } = query;
    const families = spec.families?.length ? spec.families : undefined;
    return this.api.call(
      search,
      { body: { spec: spec.converter, limits: spec.limits, families, materialIds, rankBy, offset, limit } },
      errorsShownByCaller(),
    );
  }

  evaluate(spec: DesignSpec, construction: Construction): Observable<EvaluateAnswer> {
    return this.api.call(
      evaluate,
      { query: { sweep: 'all' }, body: { spec: spec.converter, limits: spec.limits, ...construction } },
      errorsShownByCaller(),
    );
  }

  exportUrl(id: number, revision: number, kind: ExportKind): string {
    return endpointUrl(exportRevision, { id, rev: revision, kind });
  }
}
