import { HttpClient } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { beforeEach, describe, expect, it, vi } from 'vitest';

import { testingProviders } from '../testing/render';
import { userWithRole } from '../testing/users';
import { errorsShownByCaller } from './error-display';
import { httpErrorInterceptor } from './http-error-interceptor';
import { Notifier } from './notifier';
import { Session } from './session';

describe('httpErrorInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let notifier: { error: ReturnType<typeof vi.fn>; info: ReturnType<typeof vi.fn> };

  beforeEach(() => {
    notifier = { error: vi.fn(), info: vi.fn() };
    TestBed.configureTestingModule({
      providers: [...testingProviders([httpErrorInterceptor]), { provide: Notifier, useValue: notifier }],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  it("shows the server's error message and passes the error on", () => {
    const failed = vi.fn();
    http.get('/api/admin/users').subscribe({ error: failed });

    backend
      .expectOne('/api/admin/users')
      .flush({ error: { code: 'forbidden', message: 'Only administrators may do that.' } }, { status: 403, statusText: 'Forbidden' });

    expect(notifier.error).toHaveBeenCalledWith('Only administrators may do that.');
    expect(failed).toHaveBeenCalledOnce();
  });

  it('on 401 forgets the user and sends them to sign in', () => {
    const session = TestBed.inject(Session);
    session.replaceUser(userWithRole('engineer'));
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    http.get('/api/admin/audit').subscribe({ error: () => undefined });

    backend
      .expectOne('/api/admin/audit')
      .flush({ error: { code: 'unauthenticated', message: 'Sign in first.' } }, { status: 401, statusText: 'Unauthorized' });

    expect(session.user()).toBeNull();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/' } });
    expect(notifier.error).not.toHaveBeenCalled();
  });

  it('stays quiet when the caller shows the error itself', () => {
    http.post('/api/account/password', {}, errorsShownByCaller()).subscribe({ error: () => undefined });

    backend
      .expectOne('/api/account/password')
      .flush({ error: { code: 'validation', message: 'Check the fields.' } }, { status: 400, statusText: 'Bad Request' });

    expect(notifier.error).not.toHaveBeenCalled();
    expect(notifier.info).not.toHaveBeenCalled();
  });
});
