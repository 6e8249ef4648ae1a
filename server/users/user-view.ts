import type { User } from '@shared/schemas/auth';
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
