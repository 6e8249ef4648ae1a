import { afterEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting, type Rendered } from '../../testing/render';
import { Outbox } from './outbox';

describe('Outbox', () => {
  let rendered: Rendered<Outbox>;

  afterEach(() => rendered.http.verify());

  it('lists each delivery with its state and last error', async () => {
    rendered = await renderWithHttpTesting(Outbox, {}, { settle: false });
    rendered.http.expectOne('/api/admin/outbox').flush({
      messages: [],
      deliveries: [
        {
          id: 1,
          orderId: 4,
          recipient: 'shop@example.org',
          subject: 'Build order BO-0004',
          status: 'failed',
          attempts: 3,
          lastError: 'connection refused',
          createdAt: '2026-03-01T10:00:00.000Z',
          sentAt: null,
        },
      ],
    });
    await rendered.fixture.whenStable();
    const { page } = rendered;
    const cells = [...page.querySelectorAll('tr.mat-mdc-row td')].map((td) => td.textContent?.trim());
    expect(cells.slice(1)).toEqual(['shop@example.org', 'Build order BO-0004', 'Failed', '3', 'connection refused']);
    expect(page.querySelector('.gw-delivery-state')?.getAttribute('data-state')).toBe('failed');
    expect(page.textContent).toContain('The local mail server has caught no messages.');
  });
});
