import { TestBed } from '@angular/core/testing';
import { afterEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting, type Rendered } from '../../testing/render';
import { AuditLog } from './audit-log';

describe('AuditLog', () => {
  let rendered: Rendered<AuditLog>;

  afterEach(() => rendered.http.verify());

  it('shows one page of entries, the system as the actor of its own, and asks the server for the next page', async () => {
    rendered = await renderWithHttpTesting(AuditLog, {}, { settle: false });
    const first = rendered.http.expectOne((r) => r.url === '/api/admin/audit');
    expect(first.request.params.get('offset')).toBe('0');
    expect(first.request.params.get('limit')).toBe('25');
    first.flush({
      entries: [{ id: 1, at: '2026-03-01T10:00:00.000Z', actor: null, action: 'mail.sent', target: null, details: null }],
      total: 30,
    });
    await rendered.fixture.whenStable();
    const { page } = rendered;
    const cells = [...page.querySelectorAll('tr.mat-mdc-row td')].map((td) => td.textContent?.trim());
    expect(cells.slice(1)).toEqual(['System', 'mail.sent', '—', '—']);

    (page.querySelector('button.mat-mdc-paginator-navigation-next') as HTMLButtonElement).click();
    TestBed.tick();
    const next = rendered.http.expectOne((r) => r.url === '/api/admin/audit');
    expect(next.request.params.get('offset')).toBe('25');
    next.flush({ entries: [], total: 30 });
    await rendered.fixture.whenStable();
  });
});
