import { describe, expect, it } from 'vitest';
import type { OrderSummary } from '@shared/schemas/shop';

import { DesignOrders } from './design-orders';
import { renderWithHttpTesting } from '../testing/render';

const summary: OrderSummary = {
  id: 7,
  number: 'BO-0007',
  quantity: 2,
  status: 'open',
  createdAt: '2026-01-05T10:00:00.000Z',
  completedAt: null,
  revisionId: 3,
  revision: 1,
  designId: 4,
  designNumber: 'GW-0004',
  title: 'Test choke',
  built: 1,
  passed: 1,
};

describe('DesignOrders', () => {
  it('asks for this design’s orders of every state and links each to its order page with its units', async () => {
    const { fixture, http, page } = await renderWithHttpTesting(DesignOrders, { designId: 4 }, { settle: false });
    const request = http.expectOne((r) => r.url === '/api/shop/orders');
    expect(request.request.params.get('designId')).toBe('4');
    expect(request.request.params.get('status')).toBe('all');
    request.flush({ orders: [summary] });
    await fixture.whenStable();
    const link = page.querySelector<HTMLAnchorElement>('a[href="/shop/orders/7"]');
    expect(link?.textContent?.trim()).toBe('BO-0007');
    http.verify();
  });
});
