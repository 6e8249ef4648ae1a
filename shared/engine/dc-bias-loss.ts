// Core loss under DC bias. A buck inductor's core carries a large DC flux, which raises its loss above the zero-bias
// Steinmetz value. Mühlethaler, Biela, Kolar and Ecklebe ("Core losses under the DC bias condition based on Steinmetz
// parameters", IEEE Trans. Power Electronics 27(2), 2012) describe the effect by Steinmetz parameters that depend on
// the DC field H_dc in the material (their Steinmetz premagnetisation graph). Here that graph is reduced to its k:
// α and β keep their zero-bias values and k rises by the factor 1 + (H_dc/H₂)^m, H₂ the field at which the loss has
// doubled — a material's two numbers, fitted from its loss points taken under bias or typed in.
import { MU0 } from './constants';
import type { BiasLossCurve, GapKind } from './types';

/** 1 + (H/H₂)^m; exactly 1 at zero field and without data. */
export function biasLossFactor(curve: BiasLossCurve | undefined, field: number): number {
  if (!curve || !(field > 0)) return 1;
  return 1 + Math.pow(field / curve.doublingField, curve.steepness);
}

/**
 * The DC field in the core material (A/m). A distributed-gap core: the applied field N·I/le. An air-gapped core: the
 * field the ferrite itself carries at its DC flux density, B_dc/(μ0·μi) — with the initial permeability, so it reads
 * low where the ferrite's permeability has started to fall near saturation (stated approximation).
 */
export function coreDcField(
  gapKind: GapKind,
  dcFlux: number,
  permeability: number,
  turns: number,
  current: number,
  pathLength: number,
): number {
  return gapKind === 'distributed' ? (turns * current) / pathLength : dcFlux / (MU0 * permeability);
}
