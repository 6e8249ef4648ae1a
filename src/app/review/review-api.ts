import { Injectable, inject } from '@angular/core';
import { approveRevision, releaseRevision, returnRevision, revisionTimeline, submitRevision } from '@shared/api/review';
import type { Timeline, TransitionOutcome } from '@shared/schemas/review';
import type { Observable } from 'rxjs';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

export type { DesignStatus as RevisionStatus } from '@shared/schemas/designs';
export type { Timeline, TimelineEntry, TransitionOutcome } from '@shared/schemas/review';
export { STATUS_LABELS } from '../designs/format';

/** The review and release flow of one design revision; the server decides who may do what. */
@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly api = inject(Api);

  timeline(revisionId: number): Observable<Timeline> {
    return this.api.call(revisionTimeline, { params: { id: String(revisionId) } });
  }

  // Failures come back to the dialog, which shows them under its fields.

  submit(revisionId: number, comment?: string): Observable<TransitionOutcome> {
    return this.api.call(submitRevision, { params: { id: String(revisionId) }, body: comment ? { comment } : {} }, errorsShownByCaller());
  }

  approve(revisionId: number, comment?: string): Observable<TransitionOutcome> {
    return this.api.call(approveRevision, { params: { id: String(revisionId) }, body: comment ? { comment } : {} }, errorsShownByCaller());
  }

  returnToDraft(revisionId: number, comment: string): Observable<TransitionOutcome> {
    return this.api.call(returnRevision, { params: { id: String(revisionId) }, body: { comment } }, errorsShownByCaller());
  }

  release(revisionId: number, quantity: number, comment?: string): Observable<TransitionOutcome> {
    return this.api.call(
      releaseRevision,
      { params: { id: String(revisionId) }, body: comment ? { quantity, comment } : { quantity } },
      errorsShownByCaller(),
    );
  }
}
