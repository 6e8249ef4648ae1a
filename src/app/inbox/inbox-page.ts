import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import { InboxApi, inboxLink, type InboxItem } from './inbox-api';

const ICONS: Record<string, string> = { review: 'rate_review', release: 'approval', returned: 'undo', build: 'precision_manufacturing' };

/** What waits for the signed-in person: reviews, releases, returned drafts, build orders. */
@Component({
  selector: 'gw-inbox-page',
  imports: [DatePipe, MatIconModule, MatListModule, MatProgressBarModule, RouterLink],
  template: `
    <div class="gw-page">
      <h1>Waiting for me</h1>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading what waits for me" />
      } @else if (!items().length) {
        <p>Nothing is waiting for you.</p>
      } @else {
        <mat-nav-list aria-label="Items waiting for me">
          @for (item of items(); track $index) {
            <a mat-list-item [routerLink]="link(item)">
              <mat-icon matListItemIcon aria-hidden="true">{{ icon(item) }}</mat-icon>
              <span matListItemTitle>{{ item.label }}</span>
              <span matListItemLine>Since {{ item.since | date: 'medium' }}</span>
            </a>
          }
        </mat-nav-list>
      }
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InboxPage {
  private readonly api = inject(InboxApi);
  protected readonly items = signal<InboxItem[]>([]);
  protected readonly loading = signal(true);

  constructor() {
    this.api.items().subscribe({
      next: ({ items }) => {
        this.items.set(items);
        this.loading.set(false);
      },
      error: () => this.loading.set(false),
    });
  }

  protected link(item: InboxItem): string {
    return inboxLink(item);
  }

  protected icon(item: InboxItem): string {
    return ICONS[item.kind] ?? 'inbox';
  }
}
