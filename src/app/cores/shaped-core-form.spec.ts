import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';
import { ShapedCoreForm } from './shaped-core-form';

// Invented parameters of a mid-size set; Ve = Ae·le exactly so only the unit conversion is under test.
const TYPED: [string, string][] = [
  ['Name', 'Lab set 36'],
  ['Ae, effective area (mm²)', '100'],
  ['le, effective path length (mm)', '80'],
  ['Ve, effective volume (mm³)', '8000'],
  ['Window area (mm²)', '150'],
  ['Window height (mm)', '20'],
  ['Bobbin winding width (mm)', '18'],
  ['Bobbin winding height (mm)', '6'],
  ['Mean length of a turn (mm)', '60'],
  ['Outer surface for cooling (cm²)', '30'],
  ['Source of the numbers', 'our drawing 2026-11'],
];

describe('ShapedCoreForm', () => {
  let fixture: ComponentFixture<ShapedCoreForm>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(ShapedCoreForm));
  });
  afterEach(() => http.verify());

  async function submit(): Promise<void> {
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }
  const errorTexts = () => [...page.querySelectorAll('mat-error')].map((each) => each.textContent?.trim());

  it('asks for every required parameter and the source, and sends nothing', async () => {
    await submit();
    http.expectNone('/api/catalogue/cores');
    expect(errorTexts()).toEqual(['Enter a name', ...Array(9).fill('Required'), 'Say where the numbers come from']);
  });

  it('sends the parameters in SI units (mm² → m², mm → m, mm³ → m³, cm² → m²) and shows the server’s field message', async () => {
    for (const [label, value] of TYPED) typeInto(page, label, value);
    await fixture.whenStable();
    expect(page.textContent).toContain('Ae·le = 8000 mm³');
    await submit();
    const request = http.expectOne('/api/catalogue/cores');
    const body = request.request.body as Record<string, unknown>;
    expect(body).toMatchObject({ kind: 'shape', name: 'Lab set 36', family: 'ETD', source: 'our drawing 2026-11' });
    expect(body).not.toHaveProperty('amin');
    const expected = {
      ae: 1e-4,
      le: 0.08,
      ve: 8e-6,
      windowArea: 1.5e-4,
      windowHeight: 0.02,
      bobbinWidth: 0.018,
      bobbinHeight: 0.006,
      mlt: 0.06,
      surfaceArea: 0.003,
    };
    for (const [field, value] of Object.entries(expected)) expect(body[field] as number).toBeCloseTo(value, 12);
    request.flush(
      { error: { code: 'invalid_input', message: 'The core is not consistent', fields: { ve: 'Ve differs from Ae·le by 9.0 %' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(errorTexts()).toEqual(['Ve differs from Ae·le by 9.0 %']);
  });
});
