import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { DesignDetail, RevisionSummary } from '@shared/schemas/designs';
import { forkJoin, map, of, switchMap } from 'rxjs';

import { InboxApi, type InboxItem } from '../inbox/inbox-api';
import { DesignsApi } from '../designs/designs-api';
import { RevisionActions } from './revision-actions';

interface ReviewCard {
  item: InboxItem;
  revision: RevisionSummary;
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
        Approving or releasing says a qualified person has checked the design: the figures are engineering estimates and must be verified on
        a prototype before quantity builds.
      </p>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading revisions waiting for review" />
      } @else if (!cards().length) {
        <p>Nothing is waiting for review or release.</p>
      }
      @for (card of cards(); track card.revision.id) {
        <mat-card appearance="outlined" class="gw-review-card">
          <mat-card-header>
            <mat-card-title>
              <h2 class="gw-card-title">
                <a [routerLink]="['/designs', card.item.designId]">{{ card.item.label }}</a>
              </h2>
            </mat-card-title>
            <mat-card-subtitle>By {{ card.ownerName }}, waiting since {{ card.item.since | date: 'medium' }}</mat-card-subtitle>
          </mat-card-header>
          <mat-card-content>
            <gw-revision-actions [revision]="card.revision" [subject]="card.subject" (changed)="reload()" />
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
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly inbox = inject(InboxApi);
  private readonly designs = inject(DesignsApi);

  protected readonly cards = signal<ReviewCard[]>([]);
  protected readonly loading = signal(true);

  constructor() {
    this.reload();
  }

  protected reload(): void {
    this.inbox
      .items()
      .pipe(
        map(({ items }) => items.filter((item) => item.kind === 'review' || item.kind === 'release')),
        switchMap((items) =>
          items.length
            ? forkJoin(items.map((item) => this.designs.get(item.designId).pipe(map((design) => toCard(item, design)))))
            : of([]),
        ),
      )
      .subscribe({
        next: (cards) => {
          this.cards.set(cards.filter((card) => card !== null));
          this.loading.set(false);
        },
        error: () => this.loading.set(false),
      });
  }
}

/** The inbox item's revision, found by its id among the design's revisions; items whose revision is gone are left out. */
function toCard(item: InboxItem, design: DesignDetail): ReviewCard | null {
  const revision = design.revisions.find((r) => r.id === item.revisionId);
  if (!revision) return null;
  return { item, revision, ownerName: design.owner.displayName, subject: `${design.number} rev ${revision.revision}` };
}
