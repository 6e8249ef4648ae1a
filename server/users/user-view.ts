import type { AdminUser, User } from '@shared/schemas/auth';
import type { Actor } from '../http/access.ts';
import type { UserRow } from './users.repository.ts';

/** The public view of a user: never the password hash. */
export function toUserView(row: UserRow): User {
  return {
    id: row.id,
    username: row.username,
    displayName: row.displayName,
    email: row.email,
    role: row.role,
    theme: row.theme ?? null,
    disabled: row.disabled,
    createdAt: row.createdAt.toISOString(),
    lastSignInAt: row.lastSignInAt?.toISOString() ?? null,
  };
}

/** A user as the admin list shows it to `actor`: the own account can be neither disabled nor demoted (UsersService.update). */
export function toAdminUserView(user: User, actor: Actor): AdminUser {
  const other = user.id !== actor.id;
  return { ...user, canChangeRole: other, canDisable: other };
}
