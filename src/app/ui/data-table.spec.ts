import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource } from '@angular/material/table';
import { describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { DataTable, DataTableCell, type ServerPage, type TableColumn } from './data-table';

interface Part {
  name: string;
  count: number | null;
  checkedAt: string | null;
}

const PARTS: Part[] = [
  { name: 'Bobbin', count: 12, checkedAt: '2026-03-01T10:00:00.000Z' },
  { name: 'Clip', count: null, checkedAt: null },
];

@Component({
  selector: 'gw-data-table-host',
  imports: [DataTable, DataTableCell, MatSortModule],
  template: `
    <gw-data-table
      label="Parts"
      caption="Parts in stock"
      [columns]="columns"
      [rows]="rows()"
      [empty]="empty()"
      [loading]="loading()"
      loadingLabel="Loading parts"
      [failure]="failure()"
      [page]="page()"
      (paged)="pages.push($event)"
      testId="parts"
      matSort
    >
      <ng-template gwCell="action" let-part
        ><button type="button">Order {{ part.name }}</button></ng-template
      >
    </gw-data-table>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly columns: TableColumn<Part>[] = [
    { name: 'name', header: 'Part', sortable: true, text: (p) => p.name },
    { name: 'count', header: 'Count', sortable: true, sortBy: 'quantity', text: (p) => p.count, absent: 'unknown' },
    { name: 'checkedAt', header: 'Checked', text: (p) => p.checkedAt, date: true, absent: 'Never' },
    { name: 'action', header: 'Action' },
  ];
  readonly rows = signal<Part[] | MatTableDataSource<Part>>(PARTS);
  readonly page = signal<ServerPage | null>(null);
  readonly loading = signal(false);
  readonly empty = signal<string | null>('No parts.');
  readonly failure = signal<string | null>(null);
  readonly pages: PageEvent[] = [];
}

const texts = (page: HTMLElement, selector: string) => [...page.querySelectorAll(selector)].map((e) => e.textContent?.trim());

describe('DataTable', () => {
  it('lays out text, date and page-written cells in a labelled scrolling region with a hidden caption', async () => {
    const { page } = await renderWithHttpTesting(Host);
    const region = page.querySelector('[role="region"]')!;
    expect(region.getAttribute('aria-label')).toBe('Parts, scrollable');
    expect(region.getAttribute('tabindex')).toBe('0');
    expect(page.querySelector('table caption.gw-visually-hidden')?.textContent?.trim()).toBe('Parts in stock');
    expect(page.querySelector('table')?.getAttribute('data-testid')).toBe('parts');
    expect(texts(page, 'th')).toEqual(['Part', 'Count', 'Checked', 'Action']);
    const rows = [...page.querySelectorAll('tr.mat-mdc-row')].map((row) =>
      [...row.querySelectorAll('td')].map((td) => td.textContent?.trim()),
    );
    expect(rows[0].slice(0, 2)).toEqual(['Bobbin', '12']);
    expect(rows[0][2]).toMatch(/2026/);
    expect(rows[0][3]).toBe('Order Bobbin');
    expect(rows[1].slice(0, 3)).toEqual(['Clip', 'unknown', 'Never']);
    expect(page.querySelector('mat-paginator')).toBeNull();
  });

  it('gives sort headers only to sortable columns, keyed by sortBy where given', async () => {
    const { fixture, page } = await renderWithHttpTesting(Host);
    expect(page.querySelectorAll('th.mat-sort-header')).toHaveLength(2);
    const sort = fixture.debugElement.children[0].injector.get(MatSort);
    expect([...sort.sortables.keys()].sort()).toEqual(['name', 'quantity']);
  });

  it('shows the empty line when no row is left, and a server paginator that reports page changes', async () => {
    const { fixture, page } = await renderWithHttpTesting(Host);
    const source = new MatTableDataSource(PARTS);
    source.filter = 'nothing matches this';
    fixture.componentInstance.rows.set(source);
    fixture.componentInstance.page.set({ index: 1, size: 10, total: 25, sizes: [10, 20], label: 'Pages of parts' });
    await fixture.whenStable();
    expect(texts(page, 'tr.gw-no-data td')).toEqual(['No parts.']);
    expect(page.querySelector('tr.gw-no-data td')?.getAttribute('colspan')).toBe('4');
    const paginator = page.querySelector('mat-paginator')!;
    expect(paginator.getAttribute('aria-label')).toBe('Pages of parts');
    (paginator.querySelector('button.mat-mdc-paginator-navigation-next') as HTMLButtonElement).click();
    expect(fixture.componentInstance.pages.map((e) => e.pageIndex)).toEqual([2]);
  });

  it('shows what is loading above the table and in its empty line, then why it failed', async () => {
    const { fixture, page } = await renderWithHttpTesting(Host);
    fixture.componentInstance.rows.set([]);
    fixture.componentInstance.loading.set(true);
    await fixture.whenStable();
    expect(page.querySelector('mat-progress-bar')?.getAttribute('aria-label')).toBe('Loading parts');
    expect(texts(page, 'tr.gw-no-data td')).toEqual(['Loading parts…']);
    fixture.componentInstance.loading.set(false);
    fixture.componentInstance.failure.set('The parts could not be loaded.');
    await fixture.whenStable();
    expect(page.querySelector('mat-progress-bar')).toBeNull();
    expect(texts(page, '[role="alert"]')).toEqual(['The parts could not be loaded.']);
    expect(texts(page, 'tr.gw-no-data td')).toEqual(['No parts.']);
  });

  it('leaves the empty line out when the page gives none', async () => {
    const { fixture, page } = await renderWithHttpTesting(Host);
    fixture.componentInstance.rows.set([]);
    fixture.componentInstance.empty.set(null);
    await fixture.whenStable();
    expect(page.querySelector('tr.gw-no-data')).toBeNull();
    expect(page.querySelectorAll('tr')).toHaveLength(1);
  });
});
