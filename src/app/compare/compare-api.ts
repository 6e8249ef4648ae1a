import { Injectable, inject } from '@angular/core';
import { listCores } from '@shared/api/catalogue';
import { compareCurves, compareDesign, compareSavedDesign } from '@shared/api/compare';
import { listMaterials } from '@shared/api/materials';
import type { CompareCurvesResponse, CompareDesignResponse } from '@shared/schemas/compare';
import type { CallInput } from '@shared/api/endpoint';
import type { ListedCore } from '@shared/schemas/cores';
import type { MaterialSummary } from '@shared/schemas/material-answers';
import type { Observable } from 'rxjs';

import { Api, endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

export type MaterialChoice = Pick<MaterialSummary, 'id' | 'name' | 'family' | 'version'>;
export type CoreChoice = Pick<ListedCore, 'id' | 'family' | 'gapKind'>;

export interface CurvesRequest {
  materialIds: string[];
  deltaB: number;
  frequency: number;
  duty: number;
  /** Core temperature (°C). */
  temperature: number;
}

/** A design typed in on the Compare page: the request's own schema type, every current material. */
export type DesignRequest = Omit<CallInput<typeof compareDesign>['body'], 'materialIds'>;

@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly api = inject(Api);

  materialsResource() {
    return endpointResource(listMaterials, () => ({ query: {} }), {
      select: (answer): MaterialChoice[] => answer.materials,
      defaultValue: [],
    });
  }

  coresResource() {
    return endpointResource(listCores, () => ({}), { select: (answer): CoreChoice[] => answer.cores, defaultValue: [] });
  }

  curves(request: CurvesRequest): Observable<CompareCurvesResponse> {
    return this.api.call(compareCurves, { body: request }, errorsShownByCaller());
  }

  design(request: DesignRequest): Observable<CompareDesignResponse> {
    return this.api.call(compareDesign, { body: request }, errorsShownByCaller());
  }

  savedDesign(designId: number, revision: number): Observable<CompareDesignResponse> {
    return this.api.call(compareSavedDesign, { body: { designId, revision } }, errorsShownByCaller());
  }
}
