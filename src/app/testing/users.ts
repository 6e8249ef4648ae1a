import type { Role, User } from '@shared/schemas/auth';

/** An invented user for component tests; nothing here is real account data. */
export function userWithRole(role: Role, overrides: Partial<User> = {}): User {
  return {
    id: role === 'admin' ? 1 : 7,
    username: `${role}-one`,
    displayName: `Sample ${role}`,
    email: null,
    role,
    theme: null,
    disabled: false,
    createdAt: '2026-01-01T00:00:00.000Z',
    lastSignInAt: null,
    ...overrides,
  };
}
