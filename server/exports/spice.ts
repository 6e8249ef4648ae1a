// A SPICE subcircuit of the designed inductor at its operating point. Pure: figures in, text out.
import type { EvaluationResult } from '@shared/engine/index';
import { trimmedNumber } from '@shared/units/index';

export interface SpiceValues {
  /** Inductance at the load current (H). */
  inductance: number;
  /** Winding resistance at the hot-spot temperature (Ω). */
  dcResistance: number;
  /**
   * Extra resistance the ripple sees at the switching frequency: (Fr − 1)·Rdc, plus the gap's fringing-field loss over
   * the ripple's mean square ΔI²/12 (Ω).
   */
  acExtraResistance: number;
  /** Branch that carries it: R = 2·ΔR in parallel with L = 2·ΔR/(2π·fs), whose real part at fs is ΔR. */
  acBranchResistance: number;
  acBranchInductance: number;
  /** RMS voltage across the inductor over one period at Vin max (V). */
  inductorVoltageRms: number;
  /** Parallel resistance dissipating the core loss at that voltage: Vrms²/Pcore (Ω). */
  coreLossResistance: number;
}

/** Tiny resistance standing in for "no AC branch" so the netlist stays valid when Fr = 1. */
const NEGLIGIBLE = 1e-9;

export function spiceValues(result: EvaluationResult): SpiceValues {
  const op = result.operatingPoint;
  const fs = op.frequency;
  const dcResistance = result.copper.resistanceHot;
  const rippleMeanSquare = op.rippleAtVinMax ** 2 / 12;
  const gapResistance = rippleMeanSquare > 0 ? (result.copper.gapLoss ?? 0) / rippleMeanSquare : 0;
  const acExtraResistance = Math.max(0, (result.copper.acFactor - 1) * dcResistance + gapResistance);
  const branchR = Math.max(2 * acExtraResistance, NEGLIGIBLE);
  // Square wave across L: (Vin − Vout) for D, −Vout for 1 − D, at Vin max where core loss is worst.
  const onVoltage = op.onVoltageAtVinMax;
  const d = op.dutyAtVinMax;
  const offVoltage = (onVoltage * d) / (1 - d);
  const inductorVoltageRms = Math.sqrt(onVoltage ** 2 * d + offVoltage ** 2 * (1 - d));
  const coreLossResistance = result.coreLoss.loss > 0 ? inductorVoltageRms ** 2 / result.coreLoss.loss : 1e12;
  return {
    inductance: result.inductance.atLoad,
    dcResistance,
    acExtraResistance,
    acBranchResistance: branchR,
    acBranchInductance: branchR / (2 * Math.PI * fs),
    inductorVoltageRms,
    coreLossResistance,
  };
}

/**
 * Six significant digits, trailing zeros of the fraction dropped ("2.5e-5", "400000", "0.012"): through Number, so the
 * zeros of an integer part stay (a pattern on the text once turned 400000 into "4").
 */
export const spiceNumber = (x: number) => trimmedNumber(x, 6);
const num = spiceNumber;

export interface SpiceHeader {
  designNumber: string;
  title: string;
  revision: number;
  engineVersion: string;
}

/** Subcircuit name: letters, digits and underscores only, as every SPICE dialect accepts. */
export function spiceSubcircuitName(designNumber: string, revision: number): string {
  return `${designNumber}_R${revision}`.replace(/[^A-Za-z0-9_]/g, '_');
}

export function buildSpiceSubcircuit(header: SpiceHeader, result: EvaluationResult): string {
  const v = spiceValues(result);
  const op = result.operatingPoint;
  const name = spiceSubcircuitName(header.designNumber, header.revision);
  const safeTitle = header.title.replace(/[\r\n]+/g, ' ');
  const lines = [
    `* ${name}: ${safeTitle}`,
    `* Gapwright design ${header.designNumber} revision ${header.revision}, engine ${header.engineVersion}`,
    '*',
    '* How each value was derived (all at the operating point the design was evaluated for):',
    `*  L1    = ${num(v.inductance)} H: inductance at full load ${num(op.ioutMax)} A, with fringing and any`,
    `*          permeability roll-off; nominal at zero current ${num(result.inductance.nominal)} H.`,
    `*  RDC   = ${num(v.dcResistance)} ohm: winding DC resistance at the predicted hot spot`,
    `*          ${num(result.thermal.hotSpot)} degC (at 20 degC: ${num(result.copper.resistance20)} ohm).`,
    `*  RAC ∥ LAC: extra ripple resistance dR = (Fr - 1)*RDC + Pgap/Irms^2 = ${num(v.acExtraResistance)} ohm with Fr = ${num(result.copper.acFactor)}`,
    `*          (Dowell over the ripple harmonics) and Pgap = ${num(result.copper.gapLoss ?? 0)} W (the gap's fringing field on`,
    '*          the winding, over the ripple mean square); RAC = 2*dR in parallel with LAC = 2*dR/(2*pi*fs) has a',
    `*          real part of exactly dR at fs = ${num(op.frequency)} Hz, tends to zero at DC and to 2*dR far above fs.`,
    `*  RCORE = ${num(v.coreLossResistance)} ohm: Vrms^2 / Pcore with Pcore = ${num(result.coreLoss.loss)} W (iGSE at temperature)`,
    `*          and Vrms = ${num(v.inductorVoltageRms)} V across the inductor at Vin max, duty ${num(op.dutyAtVinMax)}.`,
    '*',
    '* Caution: a linear, single-frequency equivalent. It does not saturate, does not track temperature, and',
    '* matches the losses only at the stated operating point; the real part needs prototype measurement',
    '* (L versus DC bias, temperature rise at worst-case line and load) and qualified review before use.',
    '*',
    `.SUBCKT ${name} 1 2`,
    `L1 1 3 ${num(v.inductance)}`,
    `RCORE 1 3 ${num(v.coreLossResistance)}`,
    `RDC 3 4 ${num(v.dcResistance)}`,
    `RAC 4 2 ${num(v.acBranchResistance)}`,
    `LAC 4 2 ${num(v.acBranchInductance)}`,
    `.ENDS ${name}`,
    '',
  ];
  return lines.join('\n');
}
