import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { fieldLabelled, typeInto } from '../testing/form-fields';
import { libraryMaterial } from '../testing/materials';
import { renderWithHttpTesting } from '../testing/render';
import { MaterialEdit } from './material-edit';

const MATERIAL = libraryMaterial();

const BETA = 'β, flux exponent (no unit)';
const ALPHA = 'α, frequency exponent (no unit)';

describe('MaterialEdit', () => {
  let fixture: ComponentFixture<MaterialEdit>;
  let http: HttpTestingController;
  let page: HTMLElement;
  let close: ReturnType<typeof vi.fn>;

  beforeEach(async () => {
    close = vi.fn();
    TestBed.configureTestingModule({
      providers: [
        { provide: MAT_DIALOG_DATA, useValue: MATERIAL },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    ({ fixture, http, page } = await renderWithHttpTesting(MaterialEdit));
  });

  afterEach(() => http.verify());

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;
  const fieldOf = (label: string) => fieldLabelled(page, label).closest('mat-form-field')!;

  async function chooseUnitSet(label: string): Promise<void> {
    page.querySelector<HTMLElement>('mat-select[formcontrolname="unit_set"] .mat-mdc-select-trigger')!.click();
    await fixture.whenStable();
    [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => o.textContent?.trim() === label)!.click();
    await fixture.whenStable();
  }

  it('starts from the cells of the material, with the units of its unit set in the labels', () => {
    expect(fieldLabelled(page, 'Name').value).toBe('Test ferrite TF-1 (invented)');
    expect(fieldLabelled(page, BETA).value).toBe('2.5');
    expect(fieldLabelled(page, 'Lowest frequency f min (Hz)').value).toBe('50000');
    expect(fieldLabelled(page, 'Bsat at 25 °C (T)').value).toBe('0.5');
    expect(fieldLabelled(page, 'Temperature of lowest loss (°C)').value).toBe('');
    expect(fieldLabelled(page, 'Field at half permeability H½ (A/m)').value).toBe('');
    expect(page.textContent).toContain('Saving adds version 4 of this material');
  });

  it('sends only the changed cells as a PATCH of this material and closes with the new version', async () => {
    typeInto(page, BETA, '2.6');
    typeInto(page, 'Provenance: where the numbers come from', 'invented for a test, refitted');
    button('Save as version 4').click();
    await fixture.whenStable();

    const request = http.expectOne({ method: 'PATCH', url: '/api/materials/12' });
    expect(request.request.body).toEqual({ beta: '2.6', provenance: 'invented for a test, refitted' });
    const saved = { ...MATERIAL, id: '13', version: 4, beta: 2.6 };
    request.flush(saved);
    await fixture.whenStable();
    expect(close).toHaveBeenCalledWith(saved);
  });

  it('shows the server’s message on the field it names and in an alert, and stays open', async () => {
    typeInto(page, ALPHA, '3.5');
    button('Save as version 4').click();
    await fixture.whenStable();

    http.expectOne('/api/materials/12').flush(
      {
        error: {
          code: 'invalid_input',
          message: 'The edit is not valid: alpha must be between 1 and 3 (got 3.5)',
          fields: { alpha: 'alpha must be between 1 and 3 (got 3.5)' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(fieldOf(ALPHA).querySelector('mat-error')?.textContent?.trim()).toBe('alpha must be between 1 and 3 (got 3.5)');
    expect(fieldLabelled(page, ALPHA).getAttribute('aria-invalid')).toBe('true');
    expect(document.activeElement).toBe(fieldLabelled(page, ALPHA));
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('The edit is not valid: alpha must be between 1 and 3 (got 3.5)');
    expect(close).not.toHaveBeenCalled();
  });

  it('edits the temperature limit and the named temperature behaviour, and shows the server’s refusal on its field', async () => {
    const LIMIT = 'Highest temperature max_temperature (°C)';
    expect(fieldLabelled(page, LIMIT).value).toBe('');
    typeInto(page, LIMIT, '155');
    typeInto(page, 'Temperature of lowest loss (°C)', '90');
    typeInto(page, 'Loss factor there', '0');
    typeInto(page, 'Curvature (1/K²)', '0.0001');
    button('Save as version 4').click();
    await fixture.whenStable();

    const request = http.expectOne('/api/materials/12');
    expect(request.request.body).toEqual({
      lowest_loss_temperature: '90',
      lowest_loss_factor: '0',
      loss_curvature: '0.0001',
      max_temperature: '155',
    });
    const message = 'lowest_loss_factor must be greater than 0 (got 0)';
    request.flush(
      { error: { code: 'invalid_input', message: `The edit is not valid: ${message}`, fields: { lowest_loss_factor: message } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(fieldOf('Loss factor there').querySelector('mat-error')?.textContent?.trim()).toBe(message);
    expect(close).not.toHaveBeenCalled();
  });

  it('explains the named fields with hints and sends the roll-off under its own names', async () => {
    expect(fieldOf('Roll-off steepness n').querySelector('mat-hint')?.textContent).toContain('how sharply μ falls around H½');
    typeInto(page, 'Field at half permeability H½ (A/m)', '5000');
    typeInto(page, 'Roll-off steepness n', '1.8');
    button('Save as version 4').click();
    await fixture.whenStable();
    const request = http.expectOne('/api/materials/12');
    expect(request.request.body).toEqual({ rolloff_half_field: '5000', rolloff_steepness: '1.8' });
    request.flush({ ...MATERIAL, version: 4 });
    await fixture.whenStable();
  });

  it('notes Bsat at 100 °C above Bsat at 25 °C as a warning that does not stop the save', async () => {
    expect(page.querySelector('.gw-warning')).toBeNull();
    typeInto(page, 'Bsat at 100 °C (T)', '0.6');
    await fixture.whenStable();
    expect(page.querySelector('.gw-warning')?.textContent).toContain(
      'bsat_100: exceeds bsat_25: ferrite saturation normally falls with temperature; check the columns are not swapped',
    );
    button('Save as version 4').click();
    await fixture.whenStable();
    http.expectOne('/api/materials/12').flush({ ...MATERIAL, version: 4 });
    await fixture.whenStable();
  });

  it('checks only that numbers are numbers before sending anything', async () => {
    typeInto(page, BETA, '2,6');
    typeInto(page, 'Density (kg/m³)', '');
    button('Save as version 4').click();
    await fixture.whenStable();

    expect(fieldOf(BETA).querySelector('mat-error')?.textContent).toContain('Enter a plain number');
    expect(fieldOf('Density (kg/m³)').querySelector('mat-error')?.textContent?.trim()).toBe('Required');
    // http.verify() in afterEach checks that no request was made.
  });

  it('converts k, the fitted range and Bsat when the unit set changes, and sends them with it', async () => {
    await chooseUnitSet('mW/cm³, kHz, mT');

    // 1 mW/cm³ = 10³ W/m³, 1 kHz = 10³ Hz, 1 mT = 10⁻³ T, so k′ = k·10^(−3·(1 − α + β)) = 10·10⁻⁶
    // (unit arithmetic, common practice, no source).
    expect(fieldLabelled(page, 'k (mW/cm³ with f in kHz, B̂ in mT)').value).toBe('0.00001');
    expect(fieldLabelled(page, 'Lowest frequency f min (kHz)').value).toBe('50');
    expect(fieldLabelled(page, 'Highest peak flux B̂ max (mT)').value).toBe('250');
    expect(fieldLabelled(page, 'Bsat at 100 °C (mT)').value).toBe('400');

    button('Save as version 4').click();
    await fixture.whenStable();
    const request = http.expectOne('/api/materials/12');
    expect(request.request.body).toEqual({
      unit_set: 'mW/cm3-kHz-mT',
      k: '0.00001',
      f_min: '50',
      f_max: '300',
      b_min: '20',
      b_max: '250',
      bsat_25: '500',
      bsat_100: '400',
    });
    request.flush({ ...MATERIAL, version: 4 });
    await fixture.whenStable();
  });

  it('reads the stored cells again when switched back to the stored unit set, leaving nothing to send', async () => {
    await chooseUnitSet('mW/cm³, kHz, mT');
    await chooseUnitSet('W/m³, Hz, T (SI)');

    expect(fieldLabelled(page, 'k (W/m³ with f in Hz, B̂ in T)').value).toBe('10');
    expect(fieldLabelled(page, 'Lowest peak flux B̂ min (T)').value).toBe('0.02');
    button('Save as version 4').click();
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Nothing has changed');
  });
});
