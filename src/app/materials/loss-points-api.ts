import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { acceptFit, commitLossPoints, fitLossPoints, lossPoints, previewLossPoints } from '@shared/api/loss-points';
import type { FitAccept, FitAnswer, FitOptions, LossPointPreview } from '@shared/schemas/loss-points';
import { type AnswerOf, type Endpoint, endpointUrl } from '@shared/api/endpoint';
import { map, type Observable } from 'rxjs';

import { Api, endpointResource } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';
import { uploadSteps, type UploadStep } from '../core/upload-steps';
import type * as z from 'zod';

export type { FitAnswer, FitOptions, LossPointPreview } from '@shared/schemas/loss-points';
export type LossPointsAnswer = z.infer<typeof lossPoints.answer>;
export type LossPointCommit = z.infer<typeof commitLossPoints.answer>;
export type FitAccepted = z.infer<typeof acceptFit.answer>;

/** The loss points of a material version, their CSV upload, and fitting k, α, β (and the temperature behaviour) to them. */
@Injectable({ providedIn: 'root' })
export class LossPointsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(Api);

  readonly templateHref = '/api/materials/loss-points/template.csv';

  pointsResource(id: () => string | undefined) {
    return endpointResource(lossPoints, () => {
      const value = id();
      return value ? { params: { id: value } } : undefined;
    });
  }

  /** The points of one version, once (the Compare page draws them); the caller decides what a failure shows. */
  points(id: string): Observable<LossPointsAnswer> {
    return this.api.call(lossPoints, { params: { id } }, errorsShownByCaller());
  }

  /** Every row of a loss-point file with its problems by column; nothing written. */
  preview(id: string, file: File): Observable<UploadStep<LossPointPreview>> {
    return this.upload(previewLossPoints, id, file);
  }

  /** All points of the file, or none, on a new version of the material. */
  commit(id: string, file: File): Observable<UploadStep<LossPointCommit>> {
    return this.upload(commitLossPoints, id, file);
  }

  /** One CSV file in the field "file", with upload progress; the caller shows the errors (they belong beside the file). */
  private upload<E extends Endpoint>(endpoint: E, id: string, file: File): Observable<UploadStep<AnswerOf<E>>> {
    const body = new FormData();
    body.append('file', file, file.name);
    const events = this.http.request(endpoint.method, endpointUrl(endpoint, { id }), {
      body,
      ...errorsShownByCaller(),
      reportProgress: true,
      observe: 'events',
    });
    return uploadSteps(events).pipe(
      map((step) => (step.kind === 'done' ? { kind: 'done', body: endpoint.answer.parse(step.body) as AnswerOf<E> } : step)),
    );
  }

  fit(id: string, options: FitOptions): Observable<FitAnswer> {
    return this.api.call(fitLossPoints, { params: { id }, body: options }, errorsShownByCaller());
  }

  accept(id: string, options: FitAccept): Observable<FitAccepted> {
    return this.api.call(acceptFit, { params: { id }, body: options }, errorsShownByCaller());
  }
}
