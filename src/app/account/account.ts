import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';

import { ROLE_LABELS } from '../core/roles';
import { Session } from '../core/session';
import { PasswordForm } from './password-form';

@Component({
  selector: 'gw-account',
  imports: [DatePipe, PasswordForm],
  templateUrl: './account.html',
  styleUrl: './account.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Account {
  protected readonly user = inject(Session).user;
  protected readonly roleLabel = computed(() => {
    const role = this.user()?.role;
    return role ? ROLE_LABELS[role] : '';
  });
}
