import type { DesignListResponse } from '@shared/schemas/designs';
import { afterEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting, type Rendered } from '../testing/render';
import { DesignList } from './design-list';

// An invented design; the API tests check the list's paging, sorting and search on the server.
const PAGE: DesignListResponse = {
  items: [
    {
      id: 5,
      number: 'GW-0005',
      title: 'Sample rail',
      owner: { id: 7, displayName: 'Erin Example' },
      status: 'in_review',
      revision: 2,
      summary: '24–48 V → 12 V, 10 A, 250 kHz',
      updatedAt: '2026-03-01T10:00:00.000Z',
    },
  ],
  total: 41,
  page: 0,
  pageSize: 20,
};

describe('DesignList', () => {
  let rendered: Rendered<DesignList>;

  afterEach(() => rendered.http.verify());

  /** The list asks again after its short debounce; answer that request. */
  async function answer(response: DesignListResponse): Promise<URLSearchParams> {
    await new Promise((resolve) => setTimeout(resolve, 200));
    const request = rendered.http.expectOne((r) => r.url === '/api/designs');
    request.flush(response);
    await rendered.fixture.whenStable();
    return request.request.params.keys().reduce((all, key) => (all.set(key, request.request.params.get(key)!), all), new URLSearchParams());
  }

  it('shows a page of designs with their status, owner and a link, and pages and sorts on the server', async () => {
    rendered = await renderWithHttpTesting(DesignList, {}, { settle: false });
    const first = await answer(PAGE);
    expect(first.get('sort')).toBe('updated');
    const { page } = rendered;
    const cells = [...page.querySelectorAll('tr.mat-mdc-row td')].map((td) => td.textContent?.trim());
    expect(cells.slice(0, 5)).toEqual(['GW-0005', 'Sample rail', '24–48 V → 12 V, 10 A, 250 kHz', 'In review (rev. 2)', 'Erin Example']);
    expect(page.querySelector('td a')?.getAttribute('href')).toBe('/designs/5');
    expect(page.querySelector('mat-paginator')?.getAttribute('aria-label')).toBe('Pages of designs');
    expect(page.querySelector('.mat-mdc-paginator-range-label')?.textContent?.trim()).toBe('1 – 20 of 41');

    (page.querySelector('button.mat-mdc-paginator-navigation-next') as HTMLButtonElement).click();
    expect((await answer({ ...PAGE, page: 1 })).get('page')).toBe('1');

    const title = [...page.querySelectorAll('th')].find((th) => th.textContent?.trim() === 'Title')!;
    (title.querySelector('.mat-sort-header-container') as HTMLElement).click();
    const sorted = await answer(PAGE);
    expect([sorted.get('sort'), sorted.get('dir'), sorted.get('page')]).toEqual(['title', 'asc', '0']);
  });

  it('says so when no design matches', async () => {
    rendered = await renderWithHttpTesting(DesignList, {}, { settle: false });
    await answer({ ...PAGE, items: [], total: 0 });
    expect(rendered.page.querySelector('tr.gw-no-data')?.textContent?.trim()).toBe('No designs match.');
  });
});
