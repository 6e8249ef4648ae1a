import { formatNumber } from '@angular/common';
import { LOCALE_ID, Pipe, inject, type PipeTransform } from '@angular/core';
import { formatQuantity, isDisplayUnit, toDisplay, trimmedNumber, type DisplayUnit, type QuantityKind } from '@shared/units/index';

/**
 * Shows an SI value for people. With a quantity kind it picks the engineering prefix (`{{ l | quantity: 'inductance' }}`
 * → "4.7 µH"); with a display unit it stays in that unit (`{{ f | quantity: 'kHz' : '1.0-1' }}` → "250 kHz"), digits
 * as Angular's number pipe takes them (or a count of significant digits). `'bare'` leaves the unit off, for a column
 * whose header names it. A missing value shows as a dash.
 */
@Pipe({ name: 'quantity' })
export class QuantityPipe implements PipeTransform {
  private readonly locale = inject(LOCALE_ID);

  transform(
    value: number | null | undefined,
    unit: QuantityKind | DisplayUnit,
    digits?: string | number,
    show: 'unit' | 'bare' = 'unit',
  ): string {
    if (value === null || value === undefined || !Number.isFinite(value)) return '—';
    if (!isDisplayUnit(unit)) return formatQuantity(value, unit, typeof digits === 'number' ? digits : undefined);
    const shown = toDisplay(value, unit);
    const number = typeof digits === 'number' ? trimmedNumber(shown, digits) : formatNumber(shown, this.locale, digits);
    return show === 'bare' ? number : `${number} ${unit}`;
  }
}
