import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, output, signal } from '@angular/core';
import type { RevisionSummary } from '@shared/schemas/designs';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';

import { Notifier } from '../core/notifier';
import { ReviewApi, STATUS_LABELS, type TimelineEntry, type TransitionOutcome } from './review-api';
import { TransitionDialog, type TransitionAction, type TransitionDialogData } from './transition-dialog';

/**
 * The review steps one person may take on one revision, each behind a confirmation, and the revision
 * history (who, when, comment) below. The server states which steps the caller may take (`can…` flags).
 */
@Component({
  selector: 'gw-revision-actions',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    <section class="gw-revision-actions" [attr.aria-label]="'Review of ' + subject()">
      <p class="gw-status">
        Status: <strong>{{ statusLabel() }}</strong>
      </p>
      @if (actions().length) {
        <div class="gw-action-buttons">
          @for (action of actions(); track action) {
            <button
              type="button"
              [attr.data-action]="action"
              [class]="action === 'return' ? 'gw-return' : ''"
              mat-flat-button
              (click)="open(action)"
            >
              {{ buttonLabels[action] }}
            </button>
          }
        </div>
      }
      <h3 class="gw-timeline-title">Timeline</h3>
      @if (timeline().length) {
        <ol class="gw-timeline">
          @for (entry of timeline(); track entry.id) {
            <li>
              <span class="gw-timeline-step">{{ stepLabel(entry) }}</span>
              by {{ entry.actor ?? 'a removed user' }}, <time [attr.datetime]="entry.at">{{ entry.at | date: 'medium' }}</time>
              @if (entry.comment) {
                <blockquote>{{ entry.comment }}</blockquote>
              }
            </li>
          }
        </ol>
      } @else {
        <p class="gw-muted">No review steps yet.</p>
      }
    </section>
  `,
  styles: `
    .gw-action-buttons {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-block: 8px 16px;
    }
    .gw-timeline-title {
      font: var(--mat-sys-title-small);
      margin-block: 8px 4px;
    }
    .gw-timeline {
      margin: 0;
      padding-inline-start: 20px;
    }
    .gw-timeline li {
      margin-block-end: 6px;
    }
    .gw-timeline-step {
      font-weight: 600;
    }
    blockquote {
      margin: 2px 0 0;
      padding-inline-start: 8px;
      border-inline-start: 3px solid var(--mat-sys-outline-variant);
      white-space: pre-wrap;
    }
    .gw-muted {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionActions {
  private readonly api = inject(ReviewApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  /** The revision with what the caller may do with it, as the server stated it. */
  readonly revision = input.required<Pick<RevisionSummary, 'id' | 'status' | 'canSubmit' | 'canApprove' | 'canReturn' | 'canRelease'>>();
  protected readonly revisionId = computed(() => this.revision().id);
  /** How the revision is named in questions, e.g. "GW-0001 rev 2". */
  readonly subject = input('this revision');
  /** Emitted after a step has been carried out, with the new status. */
  readonly changed = output<TransitionOutcome>();

  protected readonly buttonLabels: Record<TransitionAction, string> = {
    submit: 'Submit for review',
    approve: 'Approve',
    return: 'Return with comments',
    release: 'Release',
  };

  protected readonly currentStatus = linkedSignal(() => this.revision().status);
  protected readonly statusLabel = computed(() => STATUS_LABELS[this.currentStatus()] ?? this.currentStatus());
  protected readonly timeline = signal<TimelineEntry[]>([]);

  /** The steps the server allows, in this order; none after a step until the owner of this view reloads the revision. */
  protected readonly actions = linkedSignal<TransitionAction[]>(() => {
    const r = this.revision();
    const allowed: [TransitionAction, boolean][] = [
      ['submit', r.canSubmit],
      ['approve', r.canApprove],
      ['release', r.canRelease],
      ['return', r.canReturn],
    ];
    return allowed.filter(([, may]) => may).map(([action]) => action);
  });

  constructor() {
    effect(() => this.loadTimeline(this.revisionId()));
  }

  protected stepLabel(entry: TimelineEntry): string {
    const to = entry.toStatus;
    if (to === 'in_review') return 'Submitted for review';
    if (to === 'approved') return 'Approved';
    if (to === 'released') return 'Released';
    if (to === 'superseded') return 'Superseded';
    if (to === 'draft' && entry.fromStatus) return 'Returned to draft';
    return STATUS_LABELS[to] ?? to;
  }

  protected open(action: TransitionAction): void {
    const data: TransitionDialogData = { action, revisionId: this.revisionId(), subject: this.subject() };
    this.dialog
      .open<TransitionDialog, TransitionDialogData, TransitionOutcome>(TransitionDialog, { data, width: '520px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((outcome) => {
        if (!outcome) return;
        this.currentStatus.set(outcome.status);
        this.actions.set([]);
        this.notifier.info(
          outcome.orderNumber
            ? `Released; build order ${outcome.orderNumber} sent to the winding shop.`
            : `${this.subject()} is now ${(STATUS_LABELS[outcome.status] ?? outcome.status).toLowerCase()}.`,
        );
        this.loadTimeline(this.revisionId());
        this.changed.emit(outcome);
      });
  }

  private loadTimeline(revisionId: number): void {
    this.api.timeline(revisionId).subscribe({
      next: (timeline) => this.timeline.set(timeline.entries.filter((entry) => entry.revisionId === revisionId)),
      error: () => this.timeline.set([]),
    });
  }
}
