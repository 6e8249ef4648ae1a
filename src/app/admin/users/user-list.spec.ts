import type { AdminUser } from '@shared/schemas/auth';
import { afterEach, describe, expect, it } from 'vitest';

import { typeInto } from '../../testing/form-fields';
import { renderWithHttpTesting, type Rendered } from '../../testing/render';
import { userWithRole } from '../../testing/users';
import { UserList } from './user-list';

// Invented accounts; the API tests check who may do what.
const USERS: AdminUser[] = [
  {
    ...userWithRole('winder', { id: 3, username: 'wes', displayName: 'Wes Sample', disabled: true }),
    canChangeRole: true,
    canDisable: true,
  },
  {
    ...userWithRole('admin', {
      username: 'ada',
      displayName: 'Ada Sample',
      email: 'ada@example.org',
      lastSignInAt: '2026-02-01T09:00:00.000Z',
    }),
    canChangeRole: false,
    canDisable: false,
  },
];

describe('UserList', () => {
  let rendered: Rendered<UserList>;

  afterEach(() => rendered.http.verify());

  async function listed(): Promise<HTMLElement> {
    rendered = await renderWithHttpTesting(UserList, {}, { settle: false });
    rendered.http.expectOne('/api/admin/users').flush({ users: USERS });
    await rendered.fixture.whenStable();
    return rendered.page;
  }

  const rows = (page: HTMLElement) =>
    [...page.querySelectorAll('tr.mat-mdc-row:not(.gw-no-data)')].map((row) =>
      [...row.querySelectorAll('td')].map((td) => td.textContent?.trim()),
    );

  it('lists every account sorted by username, with its status, last sign-in and what this admin may change', async () => {
    const page = await listed();
    expect([...page.querySelectorAll('th')].map((th) => th.textContent?.trim())).toEqual([
      'Username',
      'Display name',
      'E-mail',
      'Role',
      'Status',
      'Last sign-in',
      'Actions',
    ]);
    const [ada, wes] = rows(page);
    expect([ada[0], ada[2], ada[4]]).toEqual(['ada', 'ada@example.org', 'Active']);
    expect(ada[5]).toMatch(/2026/);
    expect([wes[0], wes[2], wes[4], wes[5], wes[6]]).toEqual(['wes', '—', 'Disabled', 'Never', 'Enable']);
    expect(page.querySelector('[aria-label="Role of ada"]')?.getAttribute('aria-disabled')).toBe('true');
    expect(page.querySelector<HTMLButtonElement>('button[aria-label="Disable ada"]')?.disabled).toBe(true);
    expect(page.querySelector('.gw-table-scroll[role="region"]')?.getAttribute('aria-label')).toBe('User accounts, scrollable');
  });

  it('says which filter left no account', async () => {
    const page = await listed();
    typeInto(page, 'Filter users', 'nobody');
    await rendered.fixture.whenStable();
    expect(rows(page)).toEqual([]);
    expect(page.querySelector('tr.gw-no-data')?.textContent?.trim()).toBe('No users match “nobody”.');
  });
});
