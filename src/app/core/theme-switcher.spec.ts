import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { userWithRole } from '../testing/users';
import { Session } from './session';
import { ThemeSwitcher } from './theme-switcher';

const STORAGE_KEY = 'gapwright.theme';

describe('ThemeSwitcher', () => {
  let http: HttpTestingController;
  const html = () => document.documentElement;

  beforeEach(() => {
    localStorage.clear();
    html().classList.remove('gw-theme-light', 'gw-theme-dark');
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('puts the choice stored in this browser on <html>', () => {
    localStorage.setItem(STORAGE_KEY, 'dark');

    const switcher = TestBed.inject(ThemeSwitcher);
    TestBed.tick();

    expect(switcher.theme()).toBe('dark');
    expect(html().classList.contains('gw-theme-dark')).toBe(true);
  });

  it("lets the signed-in user's saved preference win over the stored choice", () => {
    localStorage.setItem(STORAGE_KEY, 'dark');
    const switcher = TestBed.inject(ThemeSwitcher);
    TestBed.tick();

    TestBed.inject(Session).replaceUser(userWithRole('engineer', { theme: 'light' }));
    TestBed.tick();

    expect(switcher.theme()).toBe('light');
    expect(html().classList.contains('gw-theme-light')).toBe(true);
    expect(html().classList.contains('gw-theme-dark')).toBe(false);
    expect(localStorage.getItem(STORAGE_KEY)).toBe('light');
  });

  it('saves a toggle to the account of a signed-in user and remembers it locally', () => {
    localStorage.setItem(STORAGE_KEY, 'light');
    const session = TestBed.inject(Session);
    session.replaceUser(userWithRole('reviewer', { theme: 'light' }));
    const switcher = TestBed.inject(ThemeSwitcher);
    TestBed.tick();

    switcher.toggle();
    TestBed.tick();

    const request = http.expectOne('/api/account/preferences');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ theme: 'dark' });
    request.flush({ user: userWithRole('reviewer', { theme: 'dark' }) });
    TestBed.tick();
    expect(session.user()?.theme).toBe('dark');
    expect(localStorage.getItem(STORAGE_KEY)).toBe('dark');
    expect(html().classList.contains('gw-theme-dark')).toBe(true);
  });

  it('toggles without calling the server when nobody is signed in', () => {
    localStorage.setItem(STORAGE_KEY, 'dark');
    const switcher = TestBed.inject(ThemeSwitcher);

    switcher.toggle();
    TestBed.tick();

    http.expectNone('/api/account/preferences');
    expect(switcher.theme()).toBe('light');
    expect(localStorage.getItem(STORAGE_KEY)).toBe('light');
  });
});
