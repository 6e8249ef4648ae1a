import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { PasswordForm } from './password-form';
import { typeInto } from '../testing/form-fields';
import { renderWithHttpTesting } from '../testing/render';

describe('PasswordForm', () => {
  let fixture: ComponentFixture<PasswordForm>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(PasswordForm));
  });

  afterEach(() => http.verify());

  const type = (label: string, value: string) => typeInto(page, label, value);

  async function submit(current: string, fresh: string, confirmation: string): Promise<void> {
    type('Current password', current);
    type('New password', fresh);
    type('Confirm new password', confirmation);
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  const errorTexts = () => [...page.querySelectorAll('mat-error')].map((each) => each.textContent?.trim());

  it('names what is wrong under each field and sends nothing', async () => {
    await submit('', 'short', 'different');

    http.expectNone('/api/account/password');
    expect(errorTexts()).toEqual(['Enter your current password', 'At least 8 characters', 'Does not match the new password']);
  });

  it("shows the server's field message under the current-password field", async () => {
    await submit('not-my-old-one', 'a long new passphrase', 'a long new passphrase');

    const request = http.expectOne('/api/account/password');
    expect(request.request.body).toEqual({ currentPassword: 'not-my-old-one', newPassword: 'a long new passphrase' });
    request.flush(
      { error: { code: 'validation_failed', message: 'Check the fields.', fields: { currentPassword: 'Current password is wrong' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(errorTexts()).toEqual(['Current password is wrong']);
  });
});
