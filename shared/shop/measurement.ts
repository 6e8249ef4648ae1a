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
  hipot: 'pass' | 'fail' | 'not_tested';
}

export interface UnitFinding {
  check: 'inductance' | 'test-frequency' | 'resistance' | 'hipot';
  passed: boolean;
  message: string;
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
  // A reading at another test frequency is not comparable with the sheet's limits.
  const fOk = Math.abs(m.testFrequency - inductance.testFrequency) <= 0.05 * inductance.testFrequency;
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
  if (limits.hipot.required) {
    findings.push({
      check: 'hipot',
      passed: m.hipot === 'pass',
      message: m.hipot === 'pass' ? 'Hipot passed' : m.hipot === 'fail' ? 'Hipot failed' : 'Hipot required but not tested',
    });
  }
  return { passed: findings.every((f) => f.passed), resistanceAt20: r20, findings };
}
