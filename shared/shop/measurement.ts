import { COPPER_TEMPERATURE_COEFFICIENT } from '../engine/constants';
import type { SheetTestLimits } from './sheet';
import { significant as fmt } from './sheet-text';

/**
 * Winding resistance referred to 20 °C from a reading at another temperature:
 * R20 = R(T) / (1 + α20·(T − 20)), α20 = 0.00393 /K for annealed copper (IEC 60028 ρ20; α20 from memory).
 */
export function resistanceAt20(measured: number, temperature: number): number {
  return measured / (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperature - 20));
}

export interface UnitMeasurement {
  inductance: number;
  testFrequency: number;
  resistance: number;
  resistanceTemperature: number;
  /** L under DC bias (H) at the current given (A), where measured. */
  biasCurrent?: number;
  biasInductance?: number;
  hipot: 'pass' | 'fail' | 'not_tested';
}

export interface UnitFinding {
  check: 'inductance' | 'test-frequency' | 'resistance' | 'bias-inductance' | 'hipot';
  passed: boolean;
  message: string;
}

/** A reading within this share of the sheet's test frequency (or bias current) is taken as the sheet's. */
export const CONDITION_TOLERANCE = 0.05;

/** A reading at another test frequency is not comparable with the sheet's limits. */
export function testFrequencyMatches(measured: number, specified: number): boolean {
  return Math.abs(measured - specified) <= CONDITION_TOLERANCE * specified;
}

/** Each check of one built unit against the sheet's limits, in words the shop can act on. */
export function judgeUnit(
  limits: SheetTestLimits,
  m: UnitMeasurement,
): { passed: boolean; resistanceAt20: number; findings: UnitFinding[] } {
  const findings: UnitFinding[] = [];
  const { inductance } = limits;
  const lOk = m.inductance >= inductance.min && m.inductance <= inductance.max;
  findings.push({
    check: 'inductance',
    passed: lOk,
    message: `L = ${fmt(m.inductance * 1e6)} µH; limits ${fmt(inductance.min * 1e6)}–${fmt(inductance.max * 1e6)} µH`,
  });
  const fOk = testFrequencyMatches(m.testFrequency, inductance.testFrequency);
  findings.push({
    check: 'test-frequency',
    passed: fOk,
    message: fOk
      ? `Measured at ${fmt(m.testFrequency / 1e3)} kHz as specified`
      : `Measured at ${fmt(m.testFrequency / 1e3)} kHz; the sheet specifies ${fmt(inductance.testFrequency / 1e3)} kHz`,
  });
  const r20 = resistanceAt20(m.resistance, m.resistanceTemperature);
  const rOk = r20 <= limits.resistanceMax20;
  findings.push({
    check: 'resistance',
    passed: rOk,
    message: `DCR ${fmt(m.resistance * 1e3)} mΩ at ${fmt(m.resistanceTemperature, 3)} °C = ${fmt(r20 * 1e3)} mΩ at 20 °C; maximum ${fmt(limits.resistanceMax20 * 1e3)} mΩ`,
  });
  const bias = limits.biasInductance;
  if (bias) {
    const measured = m.biasCurrent !== undefined && m.biasInductance !== undefined;
    const currentOk = measured && m.biasCurrent! >= (1 - CONDITION_TOLERANCE) * bias.current;
    const ok = currentOk && m.biasInductance! >= bias.min;
    findings.push({
      check: 'bias-inductance',
      passed: ok,
      message: !measured
        ? `L under DC bias required (at ${fmt(bias.current, 3)} A) but not recorded`
        : `L = ${fmt(m.biasInductance! * 1e6)} µH at ${fmt(m.biasCurrent!, 3)} A DC; at least ${fmt(bias.min * 1e6)} µH at ${fmt(bias.current, 3)} A` +
          (currentOk ? '' : ' (measured at too low a current)'),
    });
  }
  if (limits.hipot.required) {
    findings.push({
      check: 'hipot',
      passed: m.hipot === 'pass',
      message: m.hipot === 'pass' ? 'Hipot passed' : m.hipot === 'fail' ? 'Hipot failed' : 'Hipot required but not tested',
    });
  }
  return { passed: findings.every((f) => f.passed), resistanceAt20: r20, findings };
}
