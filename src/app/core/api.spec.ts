import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ApplicationRef, Injector, provideZonelessChangeDetection, runInInjectionContext, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { changePassword } from '@shared/api/account';
import { auditPage } from '@shared/api/audit';
import { inbox } from '@shared/api/inbox';
import { beforeEach, describe, expect, it, vi } from 'vitest';

import { Api, endpointResource } from './api';

describe('calls to declared endpoints', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
  });

  it('sends the declared method and path and gives the answer parsed by the answer schema', () => {
    const answer = vi.fn();
    TestBed.inject(Api).call(inbox, {}).subscribe(answer);
    const request = backend.expectOne('/api/inbox');
    expect(request.request.method).toBe('GET');
    request.flush({
      items: [{ kind: 'build', label: 'Build BO-0001', designId: 1, orderId: 4, since: '2026-01-01T00:00:00.000Z', extra: 'dropped' }],
    });
    expect(answer).toHaveBeenCalledWith({
      items: [{ kind: 'build', label: 'Build BO-0001', designId: 1, orderId: 4, since: '2026-01-01T00:00:00.000Z' }],
    });
  });

  it('fails instead of passing on an answer that does not match the contract', () => {
    const failed = vi.fn();
    TestBed.inject(Api).call(inbox, {}).subscribe({ error: failed });
    backend.expectOne('/api/inbox').flush({ items: [{ kind: 'party', label: 'x', designId: 1, since: 'now' }] });
    expect(failed).toHaveBeenCalled();
  });

  it('completes a call whose declared answer is 204 No Content, sending the body', () => {
    const done = vi.fn();
    const failed = vi.fn();
    TestBed.inject(Api)
      .call(changePassword, { body: { currentPassword: 'old-secret', newPassword: 'new-secret-1' } })
      .subscribe({ next: done, error: failed });
    const request = backend.expectOne('/api/account/password');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ currentPassword: 'old-secret', newPassword: 'new-secret-1' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(failed).not.toHaveBeenCalled();
    expect(done).toHaveBeenCalledWith(undefined);
  });

  it('gives an httpResource the query and the answer schema as its parse', async () => {
    const offset = signal(50);
    const page = runInInjectionContext(TestBed.inject(Injector), () =>
      endpointResource(auditPage, () => ({ query: { offset: offset(), limit: 25 } })),
    );
    TestBed.tick();
    backend.expectOne('/api/admin/audit?offset=50&limit=25').flush({ entries: [], total: 3 });
    await TestBed.inject(ApplicationRef).whenStable();
    expect(page.value()).toEqual({ entries: [], total: 3 });

    offset.set(75);
    TestBed.tick();
    backend.expectOne('/api/admin/audit?offset=75&limit=25').flush({ entries: [], total: 'three' });
    await TestBed.inject(ApplicationRef).whenStable();
    expect(page.error()).toBeDefined();
  });
});
