import { HttpClient, httpResource } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { listCores } from '@shared/api/catalogue';
import type { CompareCurvesResponse, CompareDesignResponse } from '@shared/schemas/compare';
import type { ListedCore } from '@shared/schemas/cores';
import type { MaterialSummary } from '@shared/schemas/materials';
import type { Observable } from 'rxjs';

import { endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

export type MaterialChoice = Pick<MaterialSummary, 'id' | 'name' | 'family' | 'version'>;
export type CoreChoice = Pick<ListedCore, 'id' | 'family' | 'gapKind'>;

export interface CurvesRequest {
  materialIds: string[];
  deltaB: number;
  frequency: number;
  duty: number;
}

export interface DesignRequest {
  spec: { vinMin: number; vinMax: number; vout: number; ioutMax: number; frequency: number; rippleRatio: number };
  coreId: string;
  turns: number;
  wire: { kind: 'awg'; awg: number; strands: number };
}

@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  materialsResource() {
    return httpResource(() => '/api/materials', {
      parse: (body) => (body as { materials: MaterialChoice[] }).materials,
      defaultValue: [] as MaterialChoice[],
    });
  }

  coresResource() {
    return endpointResource(listCores, () => ({}), { select: (answer): CoreChoice[] => answer.cores, defaultValue: [] });
  }

  curves(request: CurvesRequest): Observable<CompareCurvesResponse> {
    return this.http.post<CompareCurvesResponse>('/api/compare/curves', request, errorsShownByCaller());
  }

  design(request: DesignRequest): Observable<CompareDesignResponse> {
    return this.http.post<CompareDesignResponse>('/api/compare/design', request, errorsShownByCaller());
  }

  savedDesign(designId: number, revision: number): Observable<CompareDesignResponse> {
    return this.http.post<CompareDesignResponse>('/api/compare/saved-design', { designId, revision }, errorsShownByCaller());
  }
}
