import { describe, expect, it } from 'vitest';
import { dutyCycle, operatingPoint } from '@shared/engine/index';
import type { ConverterSpec } from '@shared/engine/inputs';
import { buckBenchNetlist, simulateBuck } from '../../../server/solvers/buck-bench.ts';

// The engine's operating point (duty with the switch, rectifier and winding drops, ripple, peak current) checked
// against an independent circuit solver: ngspice (Debian package "ngspice", batch mode) simulates the buck power stage
// from zero current until it has settled, switched at the engine's duty. If the duty were wrong the average current
// would settle elsewhere than the load current; the ripple and peak come from the simulated waveform. Agreement within
// 2 % for ripple and peak is the target set for this check; the average within 0.5 %.

const synchronous: ConverterSpec = {
  vinMin: 36,
  vinMax: 60,
  vout: 12,
  ioutMax: 10,
  frequency: 200e3,
  rippleRatio: 0.3,
  rectifier: 'synchronous',
  highSideResistance: 0.012,
  lowSideResistance: 0.008,
  inductorResistance: 0.015,
};
const diode: ConverterSpec = {
  vinMin: 18,
  vinMax: 32,
  vout: 5,
  ioutMax: 4,
  frequency: 150e3,
  rippleRatio: 0.4,
  rectifier: 'diode',
  diodeDrop: 0.45,
  switchDrop: 0.2,
  inductorResistance: 0.03,
};

describe('operating point against ngspice (independent circuit simulation)', () => {
  for (const [name, spec] of [
    ['synchronous 36–60 V → 12 V, 10 A, 200 kHz', synchronous],
    ['diode 18–32 V → 5 V, 4 A, 150 kHz', diode],
  ] as const) {
    it(`${name}: settled average, ripple and peak at Vin max and Vin min`, async () => {
      const op = operatingPoint(spec, 0.1);
      for (const [vin, ripple] of [
        [spec.vinMax, op.rippleAtVinMax],
        [spec.vinMin, op.rippleAtVinMin],
      ] as const) {
        const duty = dutyCycle(spec, vin, spec.ioutMax);
        const simulated = await simulateBuck({ spec, vin, duty, inductance: op.inductanceMin });
        expect(Math.abs(simulated.drift)).toBeLessThan(1e-3 * spec.ioutMax);
        expect(Math.abs(simulated.average / spec.ioutMax - 1)).toBeLessThan(0.005);
        expect(Math.abs(simulated.ripple / ripple - 1)).toBeLessThan(0.02);
        expect(Math.abs(simulated.peak / (spec.ioutMax + ripple / 2) - 1)).toBeLessThan(0.02);
      }
      // The engine's peak is the worse of the two input voltages.
      expect(op.peakCurrent).toBeCloseTo(spec.ioutMax + Math.max(op.rippleAtVinMax, op.rippleAtVinMin) / 2, 12);
    }, 120_000);
  }

  it('a duty 1 % off settles at another current: the bench can tell a wrong duty', async () => {
    const op = operatingPoint(synchronous, 0.1);
    const duty = dutyCycle(synchronous, synchronous.vinMax, synchronous.ioutMax) * 1.01;
    const simulated = await simulateBuck({ spec: synchronous, vin: synchronous.vinMax, duty, inductance: op.inductanceMin });
    expect(Math.abs(simulated.average / synchronous.ioutMax - 1)).toBeGreaterThan(0.05);
  }, 120_000);

  it('writes the bench with absolute output paths and the drops as stated', () => {
    const text = buckBenchNetlist({ spec: diode, vin: 32, duty: 0.2, inductance: 20e-6 }, '/abs/current.txt');
    expect(text).toContain('wrdata /abs/current.txt i(Vsense)');
    expect(text).toContain('Vfreewheel ls 0 DC -0.450000000000');
    expect(text).toContain('Vswitch hs sw DC 0.200000000000');
  });
});
