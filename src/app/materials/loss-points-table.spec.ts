import { describe, expect, it } from 'vitest';

import { POINTS } from './fit-fixture';
import { LossPointsTable } from './loss-points-table';
import { renderWithHttpTesting } from '../testing/render';

const cells = (row: Element) => [...row.querySelectorAll('td')].map((td) => td.textContent?.trim());

describe('LossPointsTable', () => {
  it('shows each point in kHz, mT, °C, kW/m³ and A/m, with its source', async () => {
    const { page } = await renderWithHttpTesting(LossPointsTable, { points: POINTS });

    const headers = [...page.querySelectorAll('th')].map((th) => th.textContent?.trim());
    expect(headers).toEqual([
      '#',
      'Frequency (kHz)',
      'Peak flux B̂ (mT)',
      'Temperature (°C)',
      'Loss density (kW/m³)',
      'DC bias (A/m)',
      'Source',
    ]);
    const rows = page.querySelectorAll('tbody tr');
    expect(rows).toHaveLength(3);
    expect(cells(rows[0])).toEqual(['1', '100', '50', '25', '20', '—', 'bench A']);
    expect(cells(rows[2])).toEqual(['3', '200', '50', '25', '50', '30', '—']);
  });

  it('says when the version has no points', async () => {
    const { page } = await renderWithHttpTesting(LossPointsTable, { points: [] });
    expect(page.textContent).toContain('No loss points on this version yet.');
  });
});
