import bcrypt from 'bcryptjs';
import type { CreateUserRequest, Theme, UpdateUserRequest, User } from '@shared/schemas/auth';
import type { AuditService } from '../audit/audit.service.ts';
import { badRequest, conflict, notFound } from '../http/errors.ts';
import { sameName } from '../http/name-key.ts';
import type { Actor } from '../http/access.ts';
import { toUserView } from './user-view.ts';
import type { UserRow, UsersRepository } from './users.repository.ts';

export class UsersService {
  // Compared against when the username is unknown, so a miss costs as much time as a hit.
  private readonly decoyHash: string;

  constructor(
    private readonly repo: UsersRepository,
    private readonly audit: AuditService,
    private readonly bcryptCost: number,
  ) {
    this.decoyHash = bcrypt.hashSync('decoy password for timing', bcryptCost);
  }

  hashPassword(password: string): Promise<string> {
    return bcrypt.hash(password, this.bcryptCost);
  }

  /** Returns the user when the credentials are right and the account is enabled. */
  async verifyCredentials(username: string, password: string): Promise<UserRow | null> {
    const row = await this.repo.findByUsername(username.trim().toLowerCase());
    const ok = await bcrypt.compare(password, row?.passwordHash ?? this.decoyHash);
    if (!row || !ok || row.disabled) return null;
    return row;
  }

  async findActive(id: number): Promise<UserRow | null> {
    const row = await this.repo.findById(id);
    return row && !row.disabled ? row : null;
  }

  async list(): Promise<User[]> {
    return (await this.repo.list()).map(toUserView);
  }

  async create(actor: Actor, input: CreateUserRequest): Promise<User> {
    const username = input.username.toLowerCase();
    const clash = sameName(
      (await this.repo.list()).map((u) => ({ name: u.username })),
      username,
    );
    if (clash) {
      const same = clash.name === username ? '' : ` (as "${clash.name}")`;
      throw conflict(`Username "${username}" is taken${same}.`, { username: `This username is taken${same}` });
    }
    const passwordHash = await this.hashPassword(input.password);
    const row = await this.repo.transaction(async (tx) => {
      const created = await this.repo.insert(
        { username, displayName: input.displayName, email: input.email ?? null, role: input.role, passwordHash },
        tx,
      );
      await this.audit.record(
        { actorId: actor.id, action: 'user.created', target: `user:${created.username}`, details: { role: created.role } },
        tx,
      );
      return created;
    });
    return toUserView(row);
  }

  async update(actor: Actor, id: number, changes: UpdateUserRequest): Promise<User> {
    const existing = await this.repo.findById(id);
    if (!existing) throw notFound('No such user.');
    if (id === actor.id && (changes.disabled === true || (changes.role && changes.role !== 'admin'))) {
      throw badRequest('You cannot disable your own account or remove your own admin role.', {
        [changes.disabled ? 'disabled' : 'role']: 'Not allowed on your own account',
      });
    }
    const updated = await this.repo.transaction(async (tx) => {
      const row = await this.repo.update(id, changes, tx);
      if (!row) throw notFound('No such user.');
      if (changes.disabled === true || (changes.role && changes.role !== existing.role)) {
        // A disabled account or a changed role must not keep using an old session.
        await this.repo.deleteSessionsOf(id, tx);
      }
      await this.audit.record({ actorId: actor.id, action: 'user.updated', target: `user:${row.username}`, details: { ...changes } }, tx);
      return row;
    });
    return toUserView(updated);
  }

  async changePassword(actor: Actor, currentPassword: string, newPassword: string): Promise<void> {
    const row = await this.repo.findById(actor.id);
    if (!row || !(await bcrypt.compare(currentPassword, row.passwordHash))) {
      throw badRequest('The current password is not right.', { currentPassword: 'Not your current password' });
    }
    if (currentPassword === newPassword) {
      throw badRequest('Choose a password different from the current one.', {
        newPassword: 'Must differ from the current password',
      });
    }
    const passwordHash = await this.hashPassword(newPassword);
    await this.repo.transaction(async (tx) => {
      await this.repo.update(actor.id, { passwordHash }, tx);
      await this.audit.record({ actorId: actor.id, action: 'account.password_changed', target: `user:${row.username}` }, tx);
    });
  }

  async setTheme(actor: Actor, theme: Theme): Promise<User> {
    const updated = await this.repo.update(actor.id, { theme });
    if (!updated) throw notFound('No such user.');
    return toUserView(updated);
  }

  /** The signed-in user's row with the new sign-in time (null if the account was disabled meanwhile). */
  async touchSignIn(id: number): Promise<UserRow | null> {
    const row = await this.repo.touchSignIn(id);
    return row && !row.disabled ? row : null;
  }
}
