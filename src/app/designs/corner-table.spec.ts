import { describe, expect, it } from 'vitest';
import type { CornerRow } from '@shared/engine/corners';

import { renderWithHttpTesting } from '../testing/render';
import { CornerTable } from './corner-table';

// Invented figures of a 29.63 µH part with ±10 % tolerance.
const corners: CornerRow[] = [
  { corner: 'nominal', inductance: 29.63e-6, peakFlux: 0.31, temperature: 63.9, saturationFlux: 0.4429, margin: 0.3, pass: true },
  { corner: 'low', inductance: 26.667e-6, peakFlux: 0.279, temperature: 95, saturationFlux: 0.3973, margin: 0.298, pass: true },
  { corner: 'high', inductance: 32.593e-6, peakFlux: 0.341, temperature: 95, saturationFlux: 0.3973, margin: 0.142, pass: false },
];

describe('CornerTable', () => {
  it('shows each corner with its inductance, flux, Bsat and temperature in engineering units, the failing one marked', async () => {
    const { page } = await renderWithHttpTesting(CornerTable, { corners });
    const rows = [...page.querySelectorAll('tbody tr')];
    expect(rows.map((r) => r.getAttribute('data-corner'))).toEqual(['nominal', 'low', 'high']);
    const high = rows[2]!;
    expect(high.querySelector('th')?.textContent).toBe('L +10 %, hottest allowed');
    const cells = [...high.querySelectorAll('td')].map((c) => c.textContent?.trim());
    expect(cells).toEqual(['32.59 µH', '341 mT', '397 mT at 95 °C', '14.2 %', 'fails']);
    expect(high.classList).toContain('gw-bad');
    expect(rows[1]!.querySelector('th')?.textContent).toBe('L −10 %, hottest allowed');
    expect(rows[0]!.classList).not.toContain('gw-bad');
  });

  it('shows nothing for a result saved before corners were computed', async () => {
    const { page } = await renderWithHttpTesting(CornerTable, { corners: undefined });
    expect(page.querySelector('table')).toBeNull();
  });
});
