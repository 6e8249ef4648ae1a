import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { DesignDetail } from '@shared/schemas/designs';
import { switchMap, map } from 'rxjs';

import { ReviewApi, type RevisionStatus } from './review-api';
import { RevisionActions } from './revision-actions';

interface RevisionContext {
  design: DesignDetail;
  status: RevisionStatus;
}

/**
 * One revision's review steps and timeline on a page of its own (`/review/revisions/:id`). A revision is
 * created as a draft and every later status is a recorded transition, so the last step gives its status.
 */
@Component({
  selector: 'gw-revision-page',
  imports: [MatProgressBarModule, RevisionActions, RouterLink],
  template: `
    <div class="gw-page">
      @if (context(); as c) {
        <h1>{{ c.design.number }} — {{ c.design.title }}</h1>
        <p>Owner {{ c.design.owner.displayName }} · <a [routerLink]="['/designs', c.design.id]">Open the design</a></p>
        <p class="gw-caution-box">
          The figures behind this revision are engineering estimates; a qualified engineer reviews them, and a prototype
          verifies them, before quantity builds.
        </p>
        <gw-revision-actions
          [revisionId]="revisionId()"
          [status]="c.status"
          [ownerId]="c.design.owner.id"
          [subject]="c.design.number"
          (changed)="load(revisionId())"
        />
      } @else if (failed()) {
        <h1>Revision</h1>
        <p class="gw-form-error" role="alert">This revision could not be loaded.</p>
      } @else {
        <h1>Revision</h1>
        <mat-progress-bar mode="indeterminate" aria-label="Loading the revision" />
      }
    </div>
  `,
  styles: `
    .gw-caution-box {
      border: 1px solid var(--mat-sys-outline);
      padding: 8px 12px;
      max-width: 80ch;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionPage {
  private readonly api = inject(ReviewApi);
  private readonly http = inject(HttpClient);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly revisionId = computed(() => Number(this.id()));
  protected readonly context = signal<RevisionContext | null>(null);
  protected readonly failed = signal(false);

  constructor() {
    effect(() => this.load(this.revisionId()));
  }

  protected load(revisionId: number): void {
    this.api
      .timeline(revisionId)
      .pipe(
        switchMap((timeline) => {
          const own = timeline.entries.filter((e) => e.revisionId === revisionId);
          const status = (own.at(-1)?.toStatus ?? 'draft') as RevisionStatus;
          return this.http.get<DesignDetail>(`/api/designs/${timeline.designId}`).pipe(map((design) => ({ design, status })));
        }),
      )
      .subscribe({ next: (c) => this.context.set(c), error: () => this.failed.set(true) });
  }
}
