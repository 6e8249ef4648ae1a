// The limits a good unit passes, from the design's figures. Pure, SI units; the rules of the trade are in
// build-practice.ts.
import {
  BIAS_TEST_MARGIN,
  FOUR_WIRE_BELOW,
  JOINT_RESISTANCE,
  LCR_FREQUENCIES,
  LCR_LEVELS,
  leadsResistance20,
  MAX_TEST_FREQUENCY,
  METER_RESOLUTION,
  MIN_TEST_REACTANCE,
  RESISTANCE_TOLERANCE,
  TEST_FLUX_SHARE,
} from './build-practice';

export interface ResistanceLimit {
  /** The winding's own DC resistance at 20 °C (Ω). */
  winding: number;
  /** Both leads (Ω at 20 °C). */
  leads: number;
  /** Both termination joints (Ω). */
  terminations: number;
  tolerance: number;
  /** (winding + leads + terminations) × (1 + tolerance), at 20 °C (Ω). */
  max: number;
  /** Measure four-wire (Kelvin) at the pins: the limit is too small for a two-wire reading. */
  fourWire: boolean;
}

/** The predicted DC resistance at the pins at 20 °C: winding, leads and joints (Ω). */
export const predictedAtPins = (limit: ResistanceLimit): number => limit.winding + limit.leads + limit.terminations;

/** The DC resistance a good unit shows at its pins: winding, leads and joints, with the manufacturing allowance. */
export function resistanceLimit(winding20: number, copperArea: number): ResistanceLimit {
  const leads = leadsResistance20(copperArea);
  const terminations = 2 * JOINT_RESISTANCE;
  const limit = { winding: winding20, leads, terminations, tolerance: RESISTANCE_TOLERANCE, max: 0, fourWire: false };
  limit.max = predictedAtPins(limit) * (1 + RESISTANCE_TOLERANCE);
  limit.fourWire = limit.max < FOUR_WIRE_BELOW;
  return limit;
}

export interface InductanceTest {
  /** Hz */
  frequency: number;
  /** V rms */
  level: number;
  /** 2πfL at the nominal inductance (Ω). */
  reactance: number;
  /** What the meter must resolve: METER_RESOLUTION of the reactance (Ω). */
  resolution: number;
  /** Peak flux the test level drives (T): V·√2 / (2πf·N·Ae). */
  flux: number;
}

/**
 * The small-signal inductance test: the lowest LCR frequency whose reactance reaches MIN_TEST_REACTANCE, at most
 * half the switching frequency and MAX_TEST_FREQUENCY (the highest allowed where none reaches it); the largest
 * level whose flux stays below TEST_FLUX_SHARE of the ripple's peak flux (the smallest level otherwise).
 */
export function inductanceTest(p: {
  inductance: number;
  switchingFrequency: number;
  turns: number;
  ae: number;
  ripplePeakFlux: number;
}): InductanceTest {
  const cap = Math.min(MAX_TEST_FREQUENCY, p.switchingFrequency / 2);
  const allowed = LCR_FREQUENCIES.filter((f) => f <= cap);
  const usable = allowed.length ? allowed : [LCR_FREQUENCIES[0]];
  const frequency = usable.find((f) => 2 * Math.PI * f * p.inductance >= MIN_TEST_REACTANCE) ?? usable[usable.length - 1];
  const fluxPerVolt = Math.SQRT2 / (2 * Math.PI * frequency * p.turns * p.ae);
  const level = LCR_LEVELS.find((v) => v * fluxPerVolt <= TEST_FLUX_SHARE * p.ripplePeakFlux) ?? LCR_LEVELS[LCR_LEVELS.length - 1];
  const reactance = 2 * Math.PI * frequency * p.inductance;
  return { frequency, level, reactance, resolution: METER_RESOLUTION * reactance, flux: level * fluxPerVolt };
}

export interface BiasTest {
  /** DC current the unit is measured at (A). */
  current: number;
  /** The engine's inductance at that current (H). */
  predicted: number;
  /** Smallest inductance a good unit shows at that current (H): (1 − tolerance) × predicted. */
  min: number;
  /** min ÷ nominal (zero-bias) inductance. */
  fractionOfNominal: number;
}

/**
 * L at a DC current, asked for where saturation matters: less than BIAS_TEST_MARGIN left below Bsat at the hot spot,
 * or a core whose inductance falls under bias (L at the check current under 90 % of zero-bias). Null otherwise.
 */
export function biasTest(p: {
  nominal: number;
  atCheckCurrent: number;
  checkCurrent: number;
  saturationMargin: number;
  tolerance: number;
}): BiasTest | null {
  const rollsOff = p.atCheckCurrent < 0.9 * p.nominal;
  if (p.saturationMargin >= BIAS_TEST_MARGIN && !rollsOff) return null;
  const min = (1 - p.tolerance) * p.atCheckCurrent;
  return { current: p.checkCurrent, predicted: p.atCheckCurrent, min, fractionOfNominal: min / p.nominal };
}
