import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

import { ROLE_DUTIES, ROLE_LABELS } from '../core/roles';
import { Session } from '../core/session';

@Component({
  selector: 'gw-home',
  imports: [MatCardModule, MatIconModule],
  templateUrl: './home.html',
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  private readonly session = inject(Session);

  protected readonly displayName = computed(() => this.session.user()?.displayName ?? '');
  protected readonly roleLabel = computed(() => {
    const role = this.session.role();
    return role ? ROLE_LABELS[role] : '';
  });
  protected readonly roleDuties = computed(() => {
    const role = this.session.role();
    return role ? ROLE_DUTIES[role] : '';
  });
}
