import { ChangeDetectionStrategy, Component } from '@angular/core';
import type { ComponentFixture } from '@angular/core/testing';
import { beforeEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { SpecFormComponent } from './spec-form';
import { createSpecForm, formFromSpec, specFromForm } from './spec-model';

@Component({
  imports: [SpecFormComponent],
  template: `<gw-spec-form [form]="form" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly form = createSpecForm();
}

describe('SpecFormComponent', () => {
  let fixture: ComponentFixture<Host>;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, page } = await renderWithHttpTesting(Host));
  });

  const field = (label: string) => {
    const labelElement = [...page.querySelectorAll('label')].find((each) => each.textContent?.replace('*', '').trim() === label);
    const input = page.querySelector<HTMLInputElement>(`#${labelElement?.htmlFor}`);
    if (!input) throw new Error(`No field labelled ${label}`);
    return input;
  };

  async function type(label: string, text: string): Promise<void> {
    const input = field(label);
    input.value = text;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  const errors = () => [...page.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());

  it('shows the engine defaults in the limit fields', () => {
    // Engine defaults (shared/engine/inputs.ts DEFAULT_LIMITS): 40 °C ambient, 50 K rise, 0.3 T, 4 A/mm², Ku 0.4.
    expect(field('Ambient').value).toBe('40 °C');
    expect(field('Allowed rise').value).toBe('50 K');
    expect(field('Bmax').value).toBe('300 mT');
    expect(field('Current density J').value).toBe('4 A/mm²');
    expect(field('Window utilisation Ku').value).toBe('0.4');
    expect(field('Ripple ratio ΔI/Iout at Vin max').value).toBe('0.3');
    // minGap 50 µm (DEFAULT_LIMITS; common practice, no source)
    expect(field('Smallest gap the shop can hold').value).toBe('50 µm');
  });

  it('binds the smallest gap to limits.minGap in metres, typed in mm, and the placements to propose to limits.gapPlacements', async () => {
    fixture.componentInstance.form.patchValue({ vinMin: 36, vinMax: 60, vout: 12, ioutMax: 8, frequency: 100e3 });
    await type('Smallest gap the shop can hold', '0.1 mm');
    const spec = specFromForm(fixture.componentInstance.form.getRawValue());
    expect(spec?.limits?.minGap).toBeCloseTo(100e-6, 12);
    expect(formFromSpec(spec!).minGap).toBeCloseTo(100e-6, 12);
    expect(spec?.limits?.gapPlacements).toBeUndefined();
    fixture.componentInstance.form.controls.gapPlacements.setValue(['spacer']);
    const spacerOnly = specFromForm(fixture.componentInstance.form.getRawValue());
    expect(spacerOnly?.limits?.gapPlacements).toEqual(['spacer']);
    expect(formFromSpec(spacerOnly!).gapPlacements).toEqual(['spacer']);
  });

  it('binds the air speed (default 0, natural convection) and the core-to-board resistance (default none) to the limits', async () => {
    expect(field('Air speed').value).toBe('0 m/s');
    expect(field('Core to board').value).toBe('');
    fixture.componentInstance.form.patchValue({ vinMin: 36, vinMax: 60, vout: 12, ioutMax: 8, frequency: 100e3 });
    await type('Air speed', '1.5 m/s');
    await type('Core to board', '25 K/W');
    const spec = specFromForm(fixture.componentInstance.form.getRawValue());
    expect(spec?.limits?.airSpeed).toBe(1.5);
    expect(spec?.limits?.boardThermalResistance).toBe(25);
    expect(formFromSpec(spec!).boardThermalResistance).toBe(25);
    expect(formFromSpec({ ...spec!, limits: {} }).boardThermalResistance).toBeNull();
  });

  it('turns what a person types into the SI spec the API takes', async () => {
    await type('Vin min', '36 V');
    await type('Vin max', '60V');
    await type('Vout', '12 V');
    await type('Iout max', '8 A');
    await type('Switching frequency', '250kHz');
    await type('Ambient', '85 degC');
    await type('Ripple ratio ΔI/Iout at Vin max', '30 %');
    const spec = specFromForm(fixture.componentInstance.form.getRawValue());
    expect(spec?.converter).toMatchObject({ vinMin: 36, vinMax: 60, vout: 12, ioutMax: 8, frequency: 250e3, rectifier: 'synchronous' });
    expect(spec?.converter.rippleRatio).toBeCloseTo(0.3, 12);
    expect(spec?.limits?.ambient).toBeCloseTo(85, 9);
    expect(field('Switching frequency').value).toBe('250 kHz');
  });

  it('has no spec while a required figure is missing, and names a wrong unit under its field', async () => {
    await type('Vin min', '36 V');
    await type('Vout', '3 A');
    expect(errors()).toContain('Expected a voltage (V), not a current (A)');
    expect(specFromForm(fixture.componentInstance.form.getRawValue())).toBeNull();
  });

  it('checks each field against the range the server allows, in the field’s own units', async () => {
    await type('Vin min', '-60 V');
    await type('Iout max', '-2 A');
    await type('Switching frequency', '50 Hz');
    await type('Inductance tolerance', '300 %');
    // The ranges come from the request schema (vinMin 0.5…1000 V, ioutMax 0.001…500 A, frequency 1 kHz…10 MHz).
    expect(errors()).toEqual(expect.arrayContaining(['At least 500 mV', 'At least 1 mA', 'At least 1 kHz']));
    expect(errors()).toContain('At most 0.5');
  });

  it('reads a decimal comma and prefix shorthand, and says what it read; warns at Vout and the current limit', async () => {
    // While typing the field says what it reads; on leaving it the value is shown back as read ("1.5 V").
    const vinMin = field('Vin min');
    vinMin.value = '1,5 V';
    vinMin.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(page.querySelector('.gw-read-as')?.textContent).toContain('Read as 1.5 V');
    vinMin.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
    expect(vinMin.value).toBe('1.5 V');
    await type('Vin min', '36');
    await type('Switching frequency', '400k');
    expect(fixture.componentInstance.form.controls.frequency.value).toBe(400e3);
    await type('Vout', '48 V');
    expect(page.querySelector('.gw-field-warning')?.textContent).toContain('At or above Vin min (36 V)');
    await type('Vout', '12 V');
    await type('Iout max', '10 A');
    await type('Current limit', '10.5 A');
    // 10 A with 30 % ripple peaks at 11.5 A
    expect(page.querySelector('.gw-field-warning')?.textContent).toContain('Below the full-load peak inductor current of 11.5 A');
  });

  it('asks for a fixed inductance instead of a ripple when chosen, and round-trips a stored spec', async () => {
    const form = fixture.componentInstance.form;
    form.patchValue(
      formFromSpec({
        converter: {
          vinMin: 10.8,
          vinMax: 13.2,
          vout: 1.2,
          ioutMax: 15,
          frequency: 500e3,
          inductance: 220e-9,
          rectifier: 'diode',
          diodeDrop: 0.4,
        },
      }),
    );
    await fixture.whenStable();
    expect(field('Inductance (minimum)').value).toBe('220 nH');
    expect(field('Diode drop').value).toBe('400 mV');
    expect(specFromForm(form.getRawValue())?.converter).toMatchObject({ inductance: 220e-9, rectifier: 'diode', diodeDrop: 0.4 });
  });
});
