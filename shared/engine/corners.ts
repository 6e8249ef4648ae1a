// The worst-case corners of a design, built only for candidates that are shown to someone.
import type { CandidateFigures, SpecContext } from './kernel';
import type { MagneticDesign } from './magnetic-design';
import { saturationFlux, saturationMargin } from './saturation';
import type { CoreMaterial } from './types';

/** One worst-case corner: the part at a tolerance end of its inductance and at a temperature. */
export interface CornerRow {
  /** nominal: nominal L at the predicted hot spot; low / high: L at −/+ tolerance at the hottest allowed temperature. */
  corner: 'nominal' | 'low' | 'high';
  /** Inductance at the saturation-check current (H). */
  inductance: number;
  /** Peak flux at the saturation-check current, in the narrowest section (T). */
  peakFlux: number;
  /** Temperature at which Bsat is read (°C). */
  temperature: number;
  saturationFlux: number;
  /** 1 − peakFlux/saturationFlux. */
  margin: number;
  /** Meets the saturation margin, and the low corner the required inductance. */
  pass: boolean;
}

export function cornerRows(ctx: SpecContext, material: CoreMaterial, mag: MagneticDesign, f: CandidateFigures): CornerRow[] {
  const { limits, op } = ctx;
  const tolerance = limits.inductanceTolerance;
  const required = limits.saturationMargin;
  const low = mag.inductanceAtPeak * (1 - tolerance);
  const lowFlux = f.fluxPeakLocal * (1 - tolerance);
  const lowMargin = saturationMargin(lowFlux, f.saturationFluxHottest);
  return [
    {
      corner: 'nominal',
      inductance: mag.inductanceAtPeak,
      peakFlux: f.fluxPeakLocal,
      temperature: f.hotSpot,
      saturationFlux: f.saturationFluxHot,
      margin: f.saturationMargin,
      pass: f.saturationMargin >= required,
    },
    {
      corner: 'low',
      inductance: low,
      peakFlux: lowFlux,
      temperature: ctx.hottestAllowed,
      saturationFlux: saturationFlux(material, ctx.hottestAllowed),
      margin: lowMargin,
      pass: lowMargin >= required && low >= op.inductanceMin * (1 - 1e-6),
    },
    {
      corner: 'high',
      inductance: mag.inductanceAtPeak * (1 + tolerance),
      peakFlux: f.fluxPeakHigh,
      temperature: ctx.hottestAllowed,
      saturationFlux: f.saturationFluxHottest,
      margin: f.saturationMarginHigh,
      pass: f.saturationMarginHigh >= required,
    },
  ];
}
