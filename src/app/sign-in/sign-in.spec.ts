import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { Router } from '@angular/router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { httpErrorInterceptor } from '../core/http-error-interceptor';
import { Session } from '../core/session';
import { SignIn } from './sign-in';
import { typeInto } from '../testing/form-fields';
import { testingProviders } from '../testing/render';

const engineer = {
  id: 7,
  username: 'ada',
  displayName: 'Ada Example',
  email: null,
  role: 'engineer',
  theme: null,
  disabled: false,
  createdAt: '2026-01-01T00:00:00.000Z',
  lastSignInAt: null,
};

describe('SignIn', () => {
  let fixture: ComponentFixture<SignIn>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: testingProviders([httpErrorInterceptor]) });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignIn);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const type = (label: string, value: string) => typeInto(page, label, value);

  async function submitWith(username: string, password: string): Promise<void> {
    type('Username', username);
    type('Password', password);
    const button = [...page.querySelectorAll('button')].find((each) => each.textContent?.trim() === 'Sign in');
    button!.click();
    await fixture.whenStable();
  }

  const alertText = () => page.querySelector('[role="alert"]')?.textContent?.trim() ?? null;

  it('shows the wrong-credentials message under the form when the server answers 401', async () => {
    await submitWith('ada', 'not-her-password');

    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.body).toEqual({ username: 'ada', password: 'not-her-password' });
    request.flush(
      { error: { code: 'invalid_credentials', message: 'Wrong username or password.' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    await fixture.whenStable();

    expect(alertText()).toBe('Wrong username or password.');
    expect(TestBed.inject(Session).user()).toBeNull();
  });

  it('says "Too many attempts" when the server answers 429', async () => {
    await submitWith('ada', 'guess-number-six');

    http
      .expectOne('/api/auth/sign-in')
      .flush({ error: { code: 'rate_limited', message: 'Slow down.' } }, { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();

    expect(alertText()).toMatch(/^Too many attempts/);
  });

  it('sends nothing and marks the fields when they are empty', async () => {
    await submitWith('', '');

    http.expectNone('/api/auth/sign-in');
    const errors = [...page.querySelectorAll('mat-error')].map((each) => each.textContent?.trim());
    expect(errors).toEqual(['Enter your username', 'Enter your password']);
  });

  it('signs in and goes to the page it was sent from', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture.componentRef.setInput('returnUrl', '/account');

    await submitWith('ada', 'correct horse battery');
    http.expectOne('/api/auth/sign-in').flush({ user: engineer });
    await fixture.whenStable();

    expect(TestBed.inject(Session).user()?.displayName).toBe('Ada Example');
    expect(navigate).toHaveBeenCalledWith('/account');
    expect(alertText()).toBeNull();
  });
});
