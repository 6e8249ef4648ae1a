// Types the engine works with. Every quantity is a plain number in SI units
// (m, m², m³, H, A, V, Hz, T, W, W/m³, kg/m³, Ω·m); temperatures are in °C
// because every coefficient in the trade is tabulated against °C.

export const CORE_FAMILIES = ['E', 'ETD', 'EFD', 'EQ', 'PQ', 'RM', 'POT', 'RING', 'POWDER_TOROID'] as const;
export type CoreFamily = (typeof CORE_FAMILIES)[number];

/** How the core's inductance is set: a ground/spacer air gap, or a distributed gap in the material. */
export type GapKind = 'air-gap' | 'distributed';

/** Where an air-gap core's gap is made: ground into the centre leg, or a non-magnetic spacer under all legs. */
export const GAP_PLACEMENTS = ['ground', 'spacer'] as const;
export type GapPlacement = (typeof GAP_PLACEMENTS)[number];

/** The gap input that builds an evaluated design again: the ground gap, or a spacer design's spacer thickness (m). */
export function gapInputOf(gap: { placement: GapPlacement; total: number; spacer: number }): number {
  return gap.placement === 'spacer' ? gap.spacer : gap.total;
}

/** Rise of core loss with the DC field H (A/m) in the material: factor 1 + (H/doublingField)^steepness. */
export interface BiasLossCurve {
  /** H₂ (A/m): the DC field at which the loss has doubled. */
  doublingField: number;
  /** m (> 0): how steeply the loss rises around H₂. */
  steepness: number;
}

/** One core shape (a set: pair of halves, or one ring). Effective parameters per IEC 60205. */
export interface CoreShape {
  id: string; // e.g. "ETD34/17/11"
  family: CoreFamily;
  gapKind: GapKind;
  /** Effective cross-section Ae (m²). */
  ae: number;
  /** Minimum cross-section Amin (m²), where known. */
  amin?: number;
  /** Effective magnetic path length le (m). */
  le: number;
  /** Effective volume Ve (m³). */
  ve: number;
  /** Core window area available to the single winding (m²); ring cores: π·ID²/4. */
  windowArea: number;
  /** Window height along the centre leg, McLyman's G for fringing (m); ring cores: height h. */
  windowHeight: number;
  /** Bobbin winding width, i.e. traverse length of one layer (m); ring cores: π·ID (inner circumference). */
  bobbinWidth: number;
  /** Bobbin build height available for layers (m); ring cores: ID/2. */
  bobbinHeight: number;
  /** Mean length of turn of a full bobbin (m). */
  mlt: number;
  /** Exposed surface area of the wound component (m²), for the surface-dissipation law. */
  surfaceArea: number;
  /** Centre-leg (or ring) area over total outer-leg area, for spacer gaps (Ac/Ao, ≈1 for E/ETD). */
  centreToOuterLegAreaRatio?: number;
  /**
   * Shaped sets: outline of the assembled pair (m): width across the legs, height along the centre leg, depth of the
   * core. From the catalogue; absent on user cores (the thermal network then estimates it, see shapedOutline).
   */
  outline?: { width: number; height: number; depth: number };
  /** Ring cores: outer diameter, inner diameter, height (m). */
  ring?: { od: number; id: number; height: number };
  /** Where the numbers come from, e.g. "IEC 61185 nominal (from memory)". */
  source: string;
}

export const MATERIAL_FAMILIES = ['ferrite', 'powder', 'amorphous', 'nanocrystalline', 'other'] as const;
export type MaterialFamily = (typeof MATERIAL_FAMILIES)[number];

/** DC-bias roll-off of a powder material: μ%(H) = 1 / (a + b·H^c), H in A/m, result a fraction of μi. */
export interface RollOffFit {
  a: number;
  b: number;
  c: number;
}

/** A core material with Steinmetz coefficients already converted to SI. */
export interface CoreMaterial {
  id: string;
  name: string;
  family: MaterialFamily;
  /** Steinmetz Pv = k·f^α·B̂^β in W/m³ with f in Hz and B̂ (peak AC flux) in T. */
  k: number;
  alpha: number;
  beta: number;
  /** Range the coefficients were fitted on: frequency (Hz) and peak AC flux B̂ (T). */
  fitFrequencyMin: number;
  fitFrequencyMax: number;
  fitFluxMin: number;
  fitFluxMax: number;
  /**
   * Temperature correction Pv(T) = Pv·(ct2·T² − ct1·T + ct0), T in °C. Omit for no correction.
   */
  tempCoefficients?: { ct0: number; ct1: number; ct2: number };
  /** Saturation flux density at 25 °C and 100 °C (T); interpolated/extrapolated linearly. */
  bsat25: number;
  bsat100: number;
  /** Initial relative permeability μi. */
  permeability: number;
  /** Powder materials: DC-bias roll-off of permeability. */
  rollOff?: RollOffFit;
  /** Core loss under DC bias: the zero-bias loss times 1 + (H/H₂)^m, H the DC field in the material (see dc-bias-loss.ts). */
  biasLoss?: BiasLossCurve;
  /** Density (kg/m³). */
  density: number;
  /** Highest hot-spot temperature the material tolerates (°C): Curie point with margin, or a powder binder limit. */
  maxTemperature?: number;
}

export const WIRE_KINDS = ['awg', 'metric', 'litz', 'foil'] as const;
export type WireKind = (typeof WIRE_KINDS)[number];

/**
 * One conductor option: a round enamelled wire (n in hand), a litz bundle, or copper foil one turn per layer.
 * Foil: `strandDiameter` is the foil thickness (the dimension the field penetrates), `overallDiameter` the layer
 * pitch (foil plus interlayer film); its width follows the core's winding width (see `foilWidth`).
 */
export interface WireOption {
  id: string; // e.g. "AWG 20 ×2", "0.50 mm G2 ×3", "litz 100×0.071 mm"
  kind: WireKind;
  /** Bare copper diameter of one strand (m). */
  strandDiameter: number;
  /** Strands: wires in hand for round wire, strands in the bundle for litz. */
  strands: number;
  /** Overall diameter of one insulated conductor as wound (m): one enamelled wire, or the whole litz bundle. */
  overallDiameter: number;
  /** Conductors laid side by side per turn (wires in hand for round wire; 1 for a litz bundle). */
  conductorsPerTurn: number;
  /** Enamel grade per IEC 60317 (1 or 2) where relevant. */
  grade?: 1 | 2;
}
