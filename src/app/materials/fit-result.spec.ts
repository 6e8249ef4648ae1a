import { describe, expect, it } from 'vitest';

import { FIT } from './fit-fixture';
import { FitResult } from './fit-result';
import { renderWithHttpTesting } from '../testing/render';

const cells = (row: Element) => [...row.querySelectorAll('td')].map((td) => td.textContent?.trim());

describe('FitResult', () => {
  it('shows each band’s coefficients, ranges and quality, and the temperature behaviour', async () => {
    const { page } = await renderWithHttpTesting(FitResult, { fit: FIT });

    const row = page.querySelector('tbody tr')!;
    expect(cells(row)).toEqual(['1', '3.25', '1.420', '2.510', '100 – 200', '50 – 100', '4.1%', '8.0% (point 2)', '3']);
    const temperature = page.querySelector('.gw-temperature')!.textContent!.replace(/\s+/g, ' ');
    expect(temperature).toContain('Lowest loss at 92.5 °C');
    expect(temperature).toContain('curvature 0.00012 /K²');
    expect(temperature).toContain('fitted from 25 to 120 °C');
  });

  it('marks a band that misses the worst-error target', async () => {
    const missed = { ...FIT, fits: [{ ...FIT.fits[0], meetsTarget: false }], temperature: null };
    const { page } = await renderWithHttpTesting(FitResult, { fit: missed });

    expect(page.querySelector('tr.gw-misses .gw-worst')?.textContent).toContain('above the target');
    expect(page.textContent).toContain('Temperature behaviour not fitted');
  });
});
