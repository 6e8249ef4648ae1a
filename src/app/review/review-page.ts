import { DatePipe } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { DesignDetail } from '@shared/schemas/designs';
import { forkJoin, map, of, switchMap } from 'rxjs';

import { InboxApi, type InboxItem } from '../inbox/inbox-api';
import { RevisionActions } from './revision-actions';
import type { RevisionStatus } from './review-api';

interface ReviewCard {
  item: InboxItem;
  revisionId: number;
  status: RevisionStatus;
  ownerId: number;
  ownerName: string;
  subject: string;
}

/** Revisions waiting for a reviewer (in review, or approved and waiting for release), each with its actions. */
@Component({
  selector: 'gw-review-page',
  imports: [DatePipe, MatCardModule, MatProgressBarModule, RevisionActions, RouterLink],
  template: `
    <div class="gw-page">
      <h1>Review and release</h1>
      <p class="gw-caution-box">
        Approving or releasing says a qualified person has checked the design: the figures are engineering estimates and
        must be verified on a prototype before quantity builds.
      </p>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading revisions waiting for review" />
      } @else if (!cards().length) {
        <p>Nothing is waiting for review or release.</p>
      }
      @for (card of cards(); track card.revisionId) {
        <mat-card appearance="outlined" class="gw-review-card">
          <mat-card-header>
            <mat-card-title>
              <h2 class="gw-card-title"><a [routerLink]="['/designs', card.item.designId]">{{ card.item.label }}</a></h2>
            </mat-card-title>
            <mat-card-subtitle>By {{ card.ownerName }}, waiting since {{ card.item.since | date: 'medium' }}</mat-card-subtitle>
          </mat-card-header>
          <mat-card-content>
            <gw-revision-actions
              [revisionId]="card.revisionId"
              [status]="card.status"
              [ownerId]="card.ownerId"
              [subject]="card.subject"
              (changed)="reload()"
            />
          </mat-card-content>
        </mat-card>
      }
    </div>
  `,
  styles: `
    .gw-review-card {
      margin-block-end: 16px;
    }
    .gw-card-title {
      font: inherit;
      margin: 0;
    }
    .gw-caution-box {
      border: 1px solid var(--mat-sys-outline);
      padding: 8px 12px;
      max-width: 80ch;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly inbox = inject(InboxApi);
  private readonly http = inject(HttpClient);

  protected readonly cards = signal<ReviewCard[]>([]);
  protected readonly loading = signal(true);

  constructor() {
    this.reload();
  }

  protected reload(): void {
    this.inbox
      .items()
      .pipe(
        map(({ items }) => items.filter((item) => (item.kind === 'review' || item.kind === 'release') && item.revisionId !== undefined)),
        switchMap((items) =>
          items.length
            ? forkJoin(items.map((item) => this.http.get<DesignDetail>(`/api/designs/${item.designId}`).pipe(map((design) => toCard(item, design)))))
            : of([]),
        ),
      )
      .subscribe({
        next: (cards) => {
          this.cards.set(cards);
          this.loading.set(false);
        },
        error: () => this.loading.set(false),
      });
  }
}

function toCard(item: InboxItem, design: DesignDetail): ReviewCard {
  const revision = design.revisions.find((r) => item.label.includes(`rev ${r.revision} `));
  return {
    item,
    revisionId: item.revisionId!,
    status: item.kind === 'review' ? 'in_review' : 'approved',
    ownerId: design.owner.id,
    ownerName: design.owner.displayName,
    subject: `${design.number} rev ${revision?.revision ?? design.latest.revision}`,
  };
}
