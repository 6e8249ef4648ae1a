import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@shared/schemas/auth';
import { beforeEach, describe, expect, it } from 'vitest';

import { App } from './app';
import { Session } from './core/session';
import { userWithRole } from './testing/users';

describe('App shell', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
  });

  async function renderSignedInAs(role: Role | null): Promise<HTMLElement> {
    if (role) TestBed.inject(Session).replaceUser(userWithRole(role, { displayName: 'Sample Person' }));
    const fixture = TestBed.createComponent(App);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const navigationLabels = (page: HTMLElement) =>
    [...page.querySelectorAll('nav[aria-label="Main navigation"] [matListItemTitle]')].map((each) => each.textContent?.trim());

  it('shows an engineer Home but not Users or Audit log', async () => {
    const page = await renderSignedInAs('engineer');

    expect(navigationLabels(page)).toEqual(['Home', 'Designs', 'Materials', 'Cores', 'Compare', 'Winding shop']);
  });

  it('shows an admin Users and Audit log', async () => {
    const page = await renderSignedInAs('admin');

    expect(navigationLabels(page)).toEqual([
      'Home',
      'Designs',
      'Materials',
      'Cores',
      'Compare',
      'Winding shop',
      'Users',
      'Audit log',
      'Outbox',
      'Settings',
    ]);
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
