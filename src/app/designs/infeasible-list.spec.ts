import { describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { searchAnswer } from '../testing/search-answer';
import { infeasibleRows } from './candidate-rows';
import { InfeasibleList } from './infeasible-list';

describe('InfeasibleList', () => {
  it("says which gap placement the closest miss was built with, and '—' where there is no air gap", async () => {
    const answer = searchAnswer({
      candidates: [],
      infeasible: [
        {
          coreId: 'E20/10/6',
          materialId: '2',
          wireId: 'AWG 20',
          turns: 9,
          placement: 'spacer',
          totalLoss: 1.2,
          reasons: [{ code: 'gap-too-small', severity: 'error', message: 'Spacer 31 µm < 50 µm.' }],
        },
        { coreId: 'P9/5', reasons: [{ code: 'area-product', severity: 'error', message: 'Area product too small.' }] },
      ],
    });
    const rows = infeasibleRows(answer, new Map([['2', 'Sample ferrite']]));
    const { page } = await renderWithHttpTesting(InfeasibleList, { rows });
    const cells = [...page.querySelectorAll('tbody tr')].map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim()));
    expect(cells[0]).toEqual(['E20/10/6', 'Sample ferrite', 'AWG 20', '9', 'spacer under all legs', '1.2 W', 'Spacer 31 µm < 50 µm.']);
    expect(cells[1]![4]).toBe('—');
  });
});
