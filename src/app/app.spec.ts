import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { Role } from '@shared/schemas/auth';
import { beforeEach, describe, expect, it } from 'vitest';

import { App } from './app';
import { navigationFor } from './core/navigation';
import { Session } from './core/session';
import { testingProviders } from './testing/render';
import { userWithRole } from './testing/users';

describe('App shell', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: testingProviders() });
  });

  async function renderSignedInAs(role: Role | null): Promise<HTMLElement> {
    if (role) TestBed.inject(Session).replaceUser(userWithRole(role, { displayName: 'Sample Person' }));
    const fixture = TestBed.createComponent(App);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const navigationLabels = (page: HTMLElement) =>
    [...page.querySelectorAll('nav[aria-label="Main navigation"] [matListItemTitle]')].map((each) => each.textContent?.trim());

  // Which entries a role gets is navigationFor's (core/navigation.spec.ts); the shell lists exactly those.
  it.each<Role>(['engineer', 'admin'])('lists the navigation entries of a signed-in %s', async (role) => {
    const page = await renderSignedInAs(role);

    expect(navigationLabels(page)).toEqual(navigationFor(role).map((item) => item.label));
    expect(navigationLabels(page).includes('Users')).toBe(role === 'admin');
  });

  it("puts the user's display name and role in the account menu button", async () => {
    const page = await renderSignedInAs('reviewer');

    const button = page.querySelector('button[aria-label="Account menu"]');
    expect(button?.textContent).toContain('Sample Person');
    expect(button?.textContent).toContain('Reviewer');
  });

  it('counts what waits for me on the toolbar inbox button', async () => {
    TestBed.inject(Session).replaceUser(userWithRole('winder'));
    const fixture = TestBed.createComponent(App);
    await fixture.whenStable();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/inbox')
      .flush({
        items: [
          { kind: 'build', label: 'Build BO-0001', designId: 1, orderId: 1, since: '2026-01-01T00:00:00.000Z' },
          { kind: 'build', label: 'Build BO-0002', designId: 2, orderId: 2, since: '2026-01-01T00:00:00.000Z' },
        ],
      });
    await fixture.whenStable();

    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelector('a[aria-label="Waiting for me: 2"]')?.getAttribute('href')).toBe('/inbox');
  });

  it('shows no navigation or account menu to a signed-out visitor, but the caution and theme toggle', async () => {
    localStorage.setItem('gapwright.theme', 'light');

    const page = await renderSignedInAs(null);

    expect(page.querySelector('nav')).toBeNull();
    expect(page.querySelector('button[aria-label="Account menu"]')).toBeNull();
    expect(page.querySelector('button[aria-label="Switch to dark theme"]')).not.toBeNull();
    expect(page.textContent).toContain('Have every design reviewed by a qualified engineer.');
  });
});
