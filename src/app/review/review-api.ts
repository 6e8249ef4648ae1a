import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import { errorsShownByCaller } from '../core/error-display';

export type RevisionStatus = 'draft' | 'in_review' | 'approved' | 'released' | 'superseded';

export interface TimelineEntry {
  id: number;
  revisionId: number;
  fromStatus: string | null;
  toStatus: string;
  comment: string | null;
  at: string;
  actor: string | null;
}

export interface Timeline {
  designId: number;
  entries: TimelineEntry[];
}

export interface TransitionOutcome {
  revisionId: number;
  status: RevisionStatus;
  orderId?: number;
  orderNumber?: string;
}

export const STATUS_LABELS: Record<string, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  released: 'Released',
  superseded: 'Superseded',
};

/** The review and release flow of one design revision; the server decides who may do what. */
@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly http = inject(HttpClient);

  timeline(revisionId: number): Observable<Timeline> {
    return this.http.get<Timeline>(`/api/revisions/${revisionId}/timeline`);
  }

  submit(revisionId: number, comment?: string): Observable<TransitionOutcome> {
    return this.post(revisionId, 'submit', comment ? { comment } : {});
  }

  approve(revisionId: number, comment?: string): Observable<TransitionOutcome> {
    return this.post(revisionId, 'approve', comment ? { comment } : {});
  }

  returnToDraft(revisionId: number, comment: string): Observable<TransitionOutcome> {
    return this.post(revisionId, 'return', { comment });
  }

  release(revisionId: number, quantity: number, comment?: string): Observable<TransitionOutcome> {
    return this.post(revisionId, 'release', comment ? { quantity, comment } : { quantity });
  }

  /** Failures come back to the dialog, which shows them under its fields. */
  private post(revisionId: number, action: string, body: object): Observable<TransitionOutcome> {
    return this.http.post<TransitionOutcome>(`/api/revisions/${revisionId}/${action}`, body, errorsShownByCaller());
  }
}
