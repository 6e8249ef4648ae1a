import { Pipe, type PipeTransform } from '@angular/core';
import { trimmedNumber } from '@shared/units/index';

/**
 * A plain number to `digits` significant digits, trailing zeros dropped (`{{ 1.3999752 | significant: 4 }}` → "1.4";
 * `{{ 0.0012234 | significant: 4 }}` → "0.001223"): for fitted coefficients, where fixed decimals hide small values
 * and full precision hides the figure. A missing value shows as a dash.
 */
@Pipe({ name: 'significant' })
export class SignificantPipe implements PipeTransform {
  transform(value: number | null | undefined, digits = 4): string {
    if (value === null || value === undefined || !Number.isFinite(value)) return '—';
    return trimmedNumber(value, digits);
  }
}
