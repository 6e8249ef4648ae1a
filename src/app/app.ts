import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { CautionLine } from './caution-line/caution-line';
import { navigationFor } from './core/navigation';
import { InboxBadge } from './inbox/inbox-badge';
import { ROLE_LABELS } from './core/roles';
import { Session } from './core/session';
import { ThemeSwitcher } from './core/theme-switcher';

/** Below this width the navigation slides over the page instead of sitting beside it. */
const NARROW_SCREEN = '(max-width: 959.98px)';

@Component({
  selector: 'gw-root',
  imports: [
    CautionLine,
    InboxBadge,
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatSidenavModule,
    MatToolbarModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
  ],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly themeSwitcher = inject(ThemeSwitcher);

  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');

  protected readonly user = this.session.user;
  protected readonly roleLabel = computed(() => {
    const role = this.session.role();
    return role ? ROLE_LABELS[role] : '';
  });
  protected readonly navigation = computed(() => navigationFor(this.session.role()));
  protected readonly theme = this.themeSwitcher.theme;

  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe(NARROW_SCREEN)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly navigationOpen = signal(false);
  protected readonly sidenavOpened = computed(() => !this.narrow() || this.navigationOpen());

  protected toggleTheme(): void {
    this.themeSwitcher.toggle();
  }

  protected closeNavigationIfOver(): void {
    if (this.narrow()) this.navigationOpen.set(false);
  }

  protected skipToMain(): void {
    this.main().nativeElement.focus();
  }

  protected signOut(): void {
    this.session.signOut().subscribe(() => void this.router.navigateByUrl('/sign-in'));
  }
}
