import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { CoreForm } from './core-form';

import { listedUserRing } from '../testing/cores';
import { fieldLabelled, typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';

describe('CoreForm', () => {
  let fixture: ComponentFixture<CoreForm>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(CoreForm));
  });

  afterEach(() => http.verify());

  const type = (label: string, value: string) => typeInto(page, label, value);

  async function submit(): Promise<void> {
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  const errorTexts = () => [...page.querySelectorAll('mat-error')].map((each) => each.textContent?.trim());

  it('names each missing field and sends nothing', async () => {
    await submit();
    http.expectNone('/api/catalogue/cores');
    expect(errorTexts()).toEqual(['Enter a name', 'Required', 'Required', 'Required']);
  });

  it('refuses an inner diameter not below the outer one', async () => {
    type('Name', 'Ring');
    type('Outer diameter (mm)', '10');
    type('Inner diameter (mm)', '12');
    type('Height (mm)', '5');
    await submit();
    http.expectNone('/api/catalogue/cores');
    expect(errorTexts()).toEqual(['Must be smaller than the outer diameter']);
  });

  it('sends the dimensions in metres and shows the server’s field message', async () => {
    type('Name', 'ETD34/17/11');
    type('Outer diameter (mm)', '25');
    type('Inner diameter (mm)', '15');
    type('Height (mm)', '10');
    await submit();
    const request = http.expectOne('/api/catalogue/cores');
    expect(request.request.body).toEqual({
      kind: 'ring',
      name: 'ETD34/17/11',
      family: 'POWDER_TOROID',
      outerDiameter: 0.025,
      innerDiameter: 0.015,
      height: 0.01,
      source: '',
    });
    request.flush(
      { error: { code: 'conflict', message: 'A shipped core.', fields: { name: 'Name of a shipped core' } } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(errorTexts()).toEqual(['Name of a shipped core']);
  });
});

describe('CoreForm editing a user ring core', () => {
  it('starts from the stored dimensions in mm and saves a new version with PUT', async () => {
    const stored = listedUserRing();
    const { fixture, http, page } = await renderWithHttpTesting(CoreForm, { editing: stored });
    expect(fieldLabelled(page, 'Outer diameter (mm)').value).toBe('20');
    expect(fieldLabelled(page, 'Height (mm)').value).toBe('7');
    expect(fieldLabelled(page, 'Source of the dimensions (optional)').value).toBe('our drawing');
    expect(page.querySelector('button[type="submit"]')?.textContent?.trim()).toBe('Save as version 3');
    typeInto(page, 'Height (mm)', '8');
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    const request = http.expectOne('/api/catalogue/cores/7');
    expect(request.request.method).toBe('PUT');
    expect(request.request.body).toMatchObject({
      kind: 'ring',
      name: 'Lab ring 20/10/7',
      family: 'RING',
      height: 0.008,
      source: 'our drawing',
    });
    expect(request.request.body.outerDiameter).toBeCloseTo(0.02, 12);
    http.verify();
  });
});
