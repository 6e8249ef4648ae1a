import { provideHttpClient } from '@angular/common/http';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, UrlTree, provideRouter, type ActivatedRouteSnapshot, type RouterStateSnapshot } from '@angular/router';
import type { Role } from '@shared/schemas/auth';
import { beforeEach, describe, expect, it } from 'vitest';

import { userWithRole } from '../testing/users';
import { authGuard } from './auth-guard';
import { roleGuard } from './role-guard';
import { Session } from './session';
import { signedOutGuard } from './signed-out-guard';

const route = {} as ActivatedRouteSnapshot;
const stateAt = (url: string) => ({ url }) as RouterStateSnapshot;

describe('guards', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideRouter([]), provideHttpClient()],
    });
  });

  const signInAs = (role: Role) => TestBed.inject(Session).replaceUser(userWithRole(role));
  const serialise = (result: unknown) => (result instanceof UrlTree ? TestBed.inject(Router).serializeUrl(result) : result);

  it('authGuard sends a signed-out visitor to sign in, remembering where they were going', () => {
    const result = TestBed.runInInjectionContext(() => authGuard(route, stateAt('/account')));

    expect(serialise(result)).toBe('/sign-in?returnUrl=%2Faccount');
  });

  it('authGuard lets a signed-in user through', () => {
    signInAs('winder');

    expect(TestBed.runInInjectionContext(() => authGuard(route, stateAt('/account')))).toBe(true);
  });

  it('roleGuard turns an engineer away from an admin page, to home', () => {
    signInAs('engineer');

    const result = TestBed.runInInjectionContext(() => roleGuard('admin')(route, stateAt('/admin/users')));

    expect(serialise(result)).toBe('/');
  });

  it('roleGuard lets an admin open an admin page', () => {
    signInAs('admin');

    expect(TestBed.runInInjectionContext(() => roleGuard('admin')(route, stateAt('/admin/users')))).toBe(true);
  });
});

describe('signedOutGuard', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideRouter([]), provideHttpClient()],
    });
  });

  it('sends a signed-in user away from the sign-in page to home', () => {
    TestBed.inject(Session).replaceUser(userWithRole('reviewer'));

    const result = TestBed.runInInjectionContext(() => signedOutGuard(route, stateAt('/sign-in')));

    expect(result instanceof UrlTree ? TestBed.inject(Router).serializeUrl(result) : result).toBe('/');
  });

  it('shows the sign-in page to a signed-out visitor', () => {
    expect(TestBed.runInInjectionContext(() => signedOutGuard(route, stateAt('/sign-in')))).toBe(true);
  });
});
