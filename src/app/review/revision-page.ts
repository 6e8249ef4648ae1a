import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { DesignDetail, RevisionSummary } from '@shared/schemas/designs';
import { switchMap, map } from 'rxjs';

import { DesignsApi } from '../designs/designs-api';
import { ReviewApi } from './review-api';
import { ChecksPanel } from '../checks/checks-panel';
import { RevisionActions } from './revision-actions';

interface RevisionContext {
  design: DesignDetail;
  revision: RevisionSummary;
}

/**
 * One revision's review steps and timeline on a page of its own (`/review/revisions/:id`). A revision is
 * created as a draft and every later status is a recorded transition, so the last step gives its status.
 */
@Component({
  selector: 'gw-revision-page',
  imports: [ChecksPanel, MatProgressBarModule, RevisionActions, RouterLink],
  template: `
    <div class="gw-page">
      @if (context(); as c) {
        <h1>{{ c.design.number }} — {{ c.design.title }}</h1>
        <p>Owner {{ c.design.owner.displayName }} · <a [routerLink]="['/designs', c.design.id]">Open the design</a></p>
        <p class="gw-caution-box">
          The figures behind this revision are engineering estimates; a qualified engineer reviews them, and a prototype verifies them,
          before quantity builds.
        </p>
        <gw-revision-actions [revision]="c.revision" [subject]="c.design.number" (changed)="load(revisionId())" />
        <gw-checks-panel [designId]="c.design.id" [revision]="c.revision.revision" />
      } @else if (failed()) {
        <h1>Revision</h1>
        <p class="gw-form-error" role="alert">This revision could not be loaded.</p>
      } @else {
        <h1>Revision</h1>
        <mat-progress-bar mode="indeterminate" aria-label="Loading the revision" />
      }
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionPage {
  private readonly api = inject(ReviewApi);
  private readonly designs = inject(DesignsApi);

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
        switchMap((timeline) => this.designs.get(timeline.designId)),
        map((design) => {
          const revision = design.revisions.find((r) => r.id === revisionId);
          if (!revision) throw new Error(`revision ${revisionId} is not among its design's revisions`);
          return { design, revision };
        }),
      )
      .subscribe({ next: (c) => this.context.set(c), error: () => this.failed.set(true) });
  }
}
