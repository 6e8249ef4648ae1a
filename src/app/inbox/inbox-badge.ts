import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatBadgeModule } from '@angular/material/badge';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { NavigationEnd, Router, RouterLink } from '@angular/router';
import { filter, startWith, switchMap, catchError, of } from 'rxjs';

import { InboxApi } from './inbox-api';

/** Toolbar button to the inbox with the number of items waiting, refreshed on every navigation. */
@Component({
  selector: 'gw-inbox-badge',
  imports: [MatBadgeModule, MatButtonModule, MatIconModule, RouterLink],
  template: `
    <a
      mat-icon-button
      routerLink="/inbox"
      [attr.aria-label]="'Waiting for me: ' + count()"
      [matBadge]="count()"
      [matBadgeHidden]="count() === 0"
      matBadgeColor="warn"
      matBadgeSize="medium"
      aria-hidden="false"
    >
      <mat-icon aria-hidden="true">inbox</mat-icon>
    </a>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InboxBadge {
  protected readonly count = signal(0);

  constructor() {
    const api = inject(InboxApi);
    inject(Router)
      .events.pipe(
        filter((event) => event instanceof NavigationEnd),
        startWith(null),
        switchMap(() => api.items(true).pipe(catchError(() => of({ items: [] })))),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe(({ items }) => this.count.set(items.length));
  }
}
