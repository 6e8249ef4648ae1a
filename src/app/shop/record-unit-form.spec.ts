import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { RecordUnitForm } from './record-unit-form';
import type { RecordedUnit } from '@shared/schemas/shop';
import type { SheetTestLimits } from '@shared/shop/sheet';
import { typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';

const LIMITS: SheetTestLimits = {
  inductance: { nominal: 100e-6, min: 90e-6, max: 110e-6, testFrequency: 10e3, testLevel: 0.1 },
  resistanceMax20: 0.05,
  hipot: { required: false, instruction: 'Not required' },
};

describe('RecordUnitForm', () => {
  let fixture: ComponentFixture<RecordUnitForm>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(RecordUnitForm, { orderId: 5, limits: LIMITS }));
  });

  afterEach(() => http.verify());

  const type = (label: string, value: string) => typeInto(page, label, value, { leave: true });

  async function chooseHipot(value: 'pass' | 'fail' | 'not_tested'): Promise<void> {
    // The select's options live in an overlay; setting the control is what a choice does.
    (fixture.componentInstance as unknown as { form: { controls: { hipot: { setValue(v: string): void } } } }).form.controls.hipot.setValue(
      value,
    );
    await fixture.whenStable();
  }

  const submit = async () => {
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  };
  const errorTexts = () => [...page.querySelectorAll('mat-error')].map((each) => each.textContent?.trim());

  it('fills in the sheet test frequency and 20 °C, and says what is missing under each field without sending', async () => {
    const inputs = [...page.querySelectorAll<HTMLInputElement>('input')];
    expect(inputs.map((i) => i.value)).toEqual(['', '10 kHz', '', '20 °C']);

    await submit();

    http.expectNone('/api/shop/orders/5/units');
    expect(errorTexts()).toEqual(['Measured inductance is required', 'DC resistance is required', 'Choose pass, fail or not tested']);
  });

  it('sends the measurements in SI units and tells the page about the recorded unit', async () => {
    let recorded: RecordedUnit | undefined;
    fixture.componentInstance.recorded.subscribe((r) => (recorded = r));
    type('Measured inductance', '98.5 uH');
    type('DC resistance', '41 mOhm');
    type('Temperature at the DCR reading', '25 °C');
    await chooseHipot('pass');
    await submit();

    const request = http.expectOne('/api/shop/orders/5/units');
    const body = request.request.body as Record<string, number | string>;
    // micro = 1e-6, milli = 1e-3, kilo = 1e3 (BIPM SI Brochure, 9th ed., Table 7 — from memory).
    expect(body['inductance']).toBeCloseTo(98.5e-6, 12);
    expect(body['testFrequency']).toBe(10e3);
    expect(body['resistance']).toBeCloseTo(41e-3, 12);
    expect(body['resistanceTemperature']).toBe(25);
    expect(body['hipot']).toBe('pass');
    expect(body).not.toHaveProperty('notes');
    // The whole answer: the form reads it through the declared answer schema.
    const answer: RecordedUnit = {
      unit: {
        id: 11,
        orderId: 5,
        unitNumber: 1,
        inductance: 98.5e-6,
        testFrequency: 10e3,
        resistance: 41e-3,
        resistanceTemperature: 25,
        resistanceAt20: 40.2e-3,
        hipot: 'pass',
        passed: true,
        findings: [{ check: 'inductance', passed: true, message: 'L = 98.5 µH' }],
        notes: null,
        recordedBy: 4,
        recordedAt: '2026-01-05T10:00:00.000Z',
        biasCurrent: null,
        biasInductance: null,
        voidedAt: null,
        voidedBy: null,
        voidReason: null,
        canVoid: true,
      },
      orderStatus: 'open',
      passedUnits: 1,
    };
    request.flush(answer);
    await fixture.whenStable();

    expect(recorded?.unit.unitNumber).toBe(1);
    expect(page.querySelector<HTMLInputElement>('input')!.value).toBe('');
    // Ready for the next unit: emptied, not flagged.
    expect(errorTexts()).toEqual([]);
  });

  it("puts the server's field message under the field it names", async () => {
    type('Measured inductance', '98.5 uH');
    type('DC resistance', '41 mOhm');
    await chooseHipot('not_tested');
    await submit();

    http.expectOne('/api/shop/orders/5/units').flush(
      {
        error: {
          code: 'validation',
          message: 'Some fields need attention',
          fields: { testFrequency: 'testFrequency must be between 10 and 10000000 Hz' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(errorTexts()).toEqual(['testFrequency must be between 10 and 10000000 Hz']);
  });

  it('warns before saving a reading at another test frequency, and saves it only when asked again', async () => {
    type('Measured inductance', '98.5 uH');
    type('Test frequency', '100 kHz');
    type('DC resistance', '41 mOhm');
    await chooseHipot('pass');
    const warning = () => page.querySelector('.gw-unit-warning')?.textContent ?? '';
    expect(warning()).toMatch(/Measured at 100 kHz; the sheet specifies 10 kHz/);

    await submit();
    http.expectNone('/api/shop/orders/5/units');
    expect(warning()).toMatch(/record it anyway: it will be saved as failed/);
    expect(page.querySelector('button[type="submit"]')!.textContent?.trim()).toBe('Record anyway');

    await submit();
    expect(http.expectOne('/api/shop/orders/5/units').request.body).toMatchObject({ testFrequency: 100e3 });
  });

  it('asks for L under DC bias where the sheet has that test, with its current filled in, and sends both figures', async () => {
    fixture.componentRef.setInput('limits', {
      ...LIMITS,
      biasInductance: { current: 11, predicted: 100e-6, min: 90e-6, fractionOfNominal: 0.9 },
    });
    fixture.componentRef.setInput('unitNumber', 3);
    await fixture.whenStable();
    expect(page.textContent).toMatch(/At least 90 µH at 11 A/);
    expect(page.textContent).toMatch(/Recording unit 3 again/);
    type('Measured inductance', '98.5 uH');
    type('DC resistance', '41 mOhm');
    await chooseHipot('pass');
    expect(page.querySelector('.gw-unit-warning')?.textContent).toMatch(/L under DC bias at 11 A; without it this unit will fail/);
    type('L under DC bias', '95 uH');
    await fixture.whenStable();
    expect(page.querySelector('.gw-unit-warning')).toBeNull();

    await submit();
    const body = http.expectOne('/api/shop/orders/5/units').request.body as Record<string, number>;
    expect(body['biasCurrent']).toBe(11);
    expect(body['biasInductance']).toBeCloseTo(95e-6, 12);
    expect(body['unitNumber']).toBe(3);
  });
});
