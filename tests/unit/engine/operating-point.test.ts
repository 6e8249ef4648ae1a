import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dutyCycle, operatingPoint } from '@shared/engine/operating-point';
import { EngineInputError } from '@shared/engine/errors';
import type { ConverterSpec } from '@shared/engine/inputs';
import { sectionOneSpec } from './fixtures';

function inputError(run: () => unknown): EngineInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof EngineInputError) return error;
    throw error;
  }
  throw new Error('expected an EngineInputError');
}

describe('buck operating point', () => {
  it('reproduces the worked buck example (ideal CCM buck relations, Erickson & Maksimović, Fundamentals of Power Electronics — from memory)', () => {
    const op = operatingPoint(sectionOneSpec, 0);
    // Computed from L = Vout·(1 − Vout/Vin,max)/(fs·r·Iout), Ipk = Iout + ΔI/2, Irms = √(Iout² + ΔI²/12): L = 26.67 µH, Ipk = 11.5 A, Irms = 10.04 A
    expect(op.inductanceMin * 1e6).toBeCloseTo(26.67, 2);
    expect(op.peakCurrent).toBeCloseTo(11.5, 6);
    expect(op.rmsCurrent).toBeCloseTo(10.04, 2);
    expect(op.valleyCurrent).toBeCloseTo(8.5, 6);
    // Stored energy, computed: W = ½·L·Ipk² = ½·26.67e-6·11.5² = 1.763 mJ
    expect(op.storedEnergy * 1e3).toBeCloseTo(1.763, 3);
    // CCM boundary, derived algebraically from Ivalley = 0: Iout,crit = Vout(1 − D)/(2·fs·L) = ΔI/2 = 1.5 A at Vin max
    expect(op.ccmBoundaryCurrent).toBeCloseTo(1.5, 6);
  });

  it('gives lower ripple at Vin min than at Vin max (ΔI = Vout·(1 − D)/(fs·L) is largest at Vin max, derived algebraically)', () => {
    const op = operatingPoint(sectionOneSpec, 0);
    // ideal: ΔI(24 V) = 12·(1 − 0.5)/(1e5·26.67e-6) = 2.25 A [C]
    expect(op.rippleAtVinMin).toBeCloseTo(2.25, 6);
    expect(op.rippleAtVinMin).toBeLessThan(op.rippleAtVinMax);
  });

  it('designs to the minimum inductance: nominal = L/(1 − tol) (common practice, no source)', () => {
    const op = operatingPoint(sectionOneSpec, 0.2);
    expect(op.inductanceNominal / op.inductanceMin).toBeCloseTo(1 / 0.8, 12);
  });

  it('checks saturation at the current limit when that exceeds the ripple peak (common practice, no source)', () => {
    expect(operatingPoint({ ...sectionOneSpec, currentLimit: 14 }).saturationCheckCurrent).toBe(14);
    expect(operatingPoint({ ...sectionOneSpec, currentLimit: 9 }).saturationCheckCurrent).toBe(11.5);
  });

  it('balances volt-seconds for the non-synchronous duty formula (volt-second balance, derived algebraically)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 8, max: 60, noNaN: true }),
        fc.double({ min: 0.1, max: 0.7, noNaN: true }),
        fc.double({ min: 0.2, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        (vin, ratio, diodeDrop, switchDrop) => {
          const spec: ConverterSpec = {
            ...sectionOneSpec,
            vinMin: vin,
            vinMax: vin,
            vout: vin * ratio,
            rectifier: 'diode',
            diodeDrop,
            switchDrop,
          };
          const d = dutyCycle(spec, vin, 5);
          const on = vin - switchDrop - spec.vout;
          const off = spec.vout + diodeDrop;
          expect(on * d).toBeCloseTo(off * (1 - d), 9);
        },
      ),
    );
  });

  it('balances volt-seconds for the synchronous duty formula (volt-second balance, derived algebraically)', () => {
    const spec: ConverterSpec = {
      ...sectionOneSpec,
      rectifier: 'synchronous',
      highSideResistance: 0.02,
      lowSideResistance: 0.01,
      inductorResistance: 0.005,
    };
    const i = 10;
    const d = dutyCycle(spec, 36, i);
    // D = (Vout + I(RL + Rls))/(Vin − I(Rhs − Rls)) = (12 + 0.15)/(36 − 0.1) = 0.338440 [C]
    expect(d).toBeCloseTo(12.15 / 35.9, 12);
    const on = 36 - i * 0.02 - 12 - i * 0.005;
    const off = 12 + i * 0.01 + i * 0.005;
    expect(on * d).toBeCloseTo(off * (1 - d), 12);
  });

  it('takes an absolute ripple current or a given inductance', () => {
    const { rippleRatio: _r, ...base } = sectionOneSpec;
    expect(operatingPoint({ ...base, rippleCurrent: 3 }, 0).inductanceMin * 1e6).toBeCloseTo(26.67, 2);
    expect(operatingPoint({ ...base, inductance: 40e-6 }, 0).rippleAtVinMax).toBeCloseTo(8e-5 / 40e-6, 9);
  });

  it('refuses Vout ≥ Vin min, naming the field', () => {
    const error = inputError(() => operatingPoint({ ...sectionOneSpec, vout: 24 }));
    expect(error.field).toBe('vout');
    expect(error.message).toMatch(/below the minimum input voltage/);
  });

  it('refuses discontinuous conduction at full load, naming the ripple field', () => {
    const error = inputError(() => operatingPoint({ ...sectionOneSpec, rippleRatio: 2.5 }));
    expect(error.field).toBe('rippleRatio');
    expect(error.message).toMatch(/discontinuous/);
    const { rippleRatio: _r, ...base } = sectionOneSpec;
    expect(inputError(() => operatingPoint({ ...base, inductance: 2e-6 })).field).toBe('inductance');
  });

  it('warns when the minimum load runs in DCM', () => {
    const op = operatingPoint({ ...sectionOneSpec, ioutMin: 1 });
    expect(op.warnings.map((w) => w.code)).toContain('dcm-at-min-load');
    expect(operatingPoint({ ...sectionOneSpec, ioutMin: 2 }).warnings).toHaveLength(0);
  });
});
