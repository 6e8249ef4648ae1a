import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { designDetail, revisionSummary } from '../testing/designs';
import { renderWithHttpTesting } from '../testing/render';
import { RevisionsPanel } from './revisions-panel';

describe('RevisionsPanel', () => {
  let fixture: ComponentFixture<RevisionsPanel>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    const revisions = [1, 2, 3].map((revision) => revisionSummary({ id: 10 + revision, revision }));
    ({ fixture, http, page } = await renderWithHttpTesting(RevisionsPanel, { design: designDetail({ revisions }) }));
  });

  afterEach(() => http.verify());

  it('compares the two latest revisions at once, naming each figure in words with its unit', async () => {
    const request = http.expectOne((r) => r.url === '/api/designs/5/diff');
    expect(request.request.params.get('from')).toBe('2');
    expect(request.request.params.get('to')).toBe('3');
    request.flush({
      from: 2,
      to: 3,
      spec: [{ path: 'converter.frequency', from: 100e3, to: 400e3 }],
      construction: [{ path: 'placement', from: 'ground', to: 'spacer' }],
      result: [
        { path: 'copper.resistance20', from: 0.00039605, to: 0.00041 },
        { path: 'winding.copperFill', from: 0.41, to: 0.385 },
        { path: 'some.newFigure', from: 1.23456789, to: 2 },
      ],
    });
    await fixture.whenStable();

    const rows = [...page.querySelectorAll('.gw-diff tbody tr')].map((tr) =>
      [...tr.children].map((cell) => cell.textContent!.trim()).join(' | '),
    );
    expect(rows).toEqual([
      'Switching frequency | 100 kHz | 400 kHz',
      'Gap placement | ground | spacer',
      'DC resistance at 20 °C | 396.1 µΩ | 410 µΩ',
      'Window fill | 41 % | 38.5 %',
      'Some › new figure | 1.2346 | 2',
    ]);
    expect(page.querySelector('.gw-diff th[scope="row"]')?.getAttribute('title')).toBe('converter.frequency');
  });
});
