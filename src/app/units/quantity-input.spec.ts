import { ChangeDetectionStrategy, Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { beforeEach, describe, expect, it } from 'vitest';

import { QuantityInput } from './quantity-input';

@Component({
  imports: [QuantityInput, ReactiveFormsModule],
  template: `
    <gw-quantity-input label="Input voltage" kind="voltage" [formControl]="voltage" [min]="1" [required]="true" />
    <gw-quantity-input label="Inductance" kind="inductance" [formControl]="inductance" />
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly voltage = new FormControl<number | null>(12);
  readonly inductance = new FormControl<number | null>(null);
}

describe('QuantityInput', () => {
  let fixture: ComponentFixture<Host>;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(Host);
    page = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const inputs = () => [...page.querySelectorAll<HTMLInputElement>('input')];
  const errors = () => [...page.querySelectorAll('mat-error')].map((e) => e.textContent?.trim());

  async function type(index: number, text: string, leave = true): Promise<void> {
    const field = inputs()[index];
    field.value = text;
    field.dispatchEvent(new Event('input'));
    if (leave) field.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  it('shows the form value in engineering notation', () => {
    expect(inputs()[0].value).toBe('12 V');
    expect(inputs()[1].value).toBe('');
  });

  it('gives the form the SI value of what was typed and shows it back with a prefix', async () => {
    await type(1, '4.7uH');
    // micro = 1e-6 (BIPM SI Brochure, 9th ed., Table 7 — from memory).
    expect(fixture.componentInstance.inductance.value).toBeCloseTo(4.7e-6, 15);
    expect(inputs()[1].value).toBe('4.7 µH');
    await type(0, '350 mV');
    expect(errors()).toEqual(['At least 1 V']);
  });

  it('puts a current typed into a voltage field under the field as an error and makes the control invalid', async () => {
    await type(0, '3 A');
    expect(errors()).toEqual(['Expected a voltage (V), not a current (A)']);
    expect(fixture.componentInstance.voltage.value).toBeNull();
    expect(fixture.componentInstance.voltage.invalid).toBe(true);
    expect(inputs()[0].getAttribute('aria-invalid')).toBe('true');
  });

  it('shows no error before the field is left, and the required message after', async () => {
    await type(0, '', false);
    expect(errors()).toEqual([]);
    inputs()[0].dispatchEvent(new Event('blur'));
    await fixture.whenStable();
    expect(errors()).toEqual(['Input voltage is required']);
  });

  it("shows an error the form puts on the control (the server's message)", async () => {
    const control = fixture.componentInstance.inductance;
    control.setErrors({ server: 'inductance must be between 1e-9 and 1 H' });
    control.markAsTouched();
    await fixture.whenStable();
    expect(errors()).toEqual(['inductance must be between 1e-9 and 1 H']);
  });
});
