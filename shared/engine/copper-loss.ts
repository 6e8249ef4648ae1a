import { COPPER_TEMPERATURE_COEFFICIENT } from './constants';
import { copperResistanceRatio } from './copper';
import { dowellProximityTerm, dowellSkinTerm, proximityFactor } from './dowell';
import type { HarmonicWeights } from './harmonics';

/** A harmonic sum stops once the envelope of the next term is below this fraction of the running sum. */
const RELATIVE_TOLERANCE = 1e-6;

/**
 * Σ I_n²/2·skinTerm(Δ1√n) and Σ I_n²/2·proximityTerm(Δ1√n): the layer count enters only as a weight on the
 * second sum, so one pair of sums serves every layer count of the same wire.
 */
export interface AcLossSums {
  skin: number;
  proximity: number;
  /** Σ I_n²/2 over the same harmonics (the ripple mean square, → ΔI²/12). */
  meanSquare: number;
  harmonicsUsed: number;
}

export function acLossSums(firstHarmonicDelta: number, weights: HarmonicWeights): AcLossSums {
  let skin = 0;
  let proximity = 0;
  let meanSquare = 0;
  const count = weights.meanSquare.length;
  let n = 1;
  for (; n <= count; n++) {
    const delta = firstHarmonicDelta * Math.sqrt(n);
    const skinTerm = dowellSkinTerm(delta);
    const proximityTerm = dowellProximityTerm(delta);
    const w = weights.meanSquare[n - 1]!;
    skin += w * skinTerm;
    proximity += w * proximityTerm;
    meanSquare += w;
    const bound = weights.envelope[n - 1]!;
    if (bound * skinTerm < RELATIVE_TOLERANCE * skin && bound * proximityTerm <= RELATIVE_TOLERANCE * proximity) break;
  }
  return { skin, proximity, meanSquare, harmonicsUsed: Math.min(n, count) };
}

/** Σ Fr(Δ1√n, m)·I_n²/2: the ripple's mean square weighted by the AC factor of each harmonic (A²). */
export function rippleResistanceWeight(sums: AcLossSums, layers: number): number {
  return sums.skin + proximityFactor(layers) * sums.proximity;
}

/** Ripple copper loss Pac = Rdc·Σ Fr(Δ1√n, m)·I_n²/2 from precomputed sums (W). */
export function acCopperLoss(resistance: number, sums: AcLossSums, layers: number): number {
  return resistance * rippleResistanceWeight(sums, layers);
}

/** Effective Rac/Rdc of the ripple current: Σ Fr·I_n²/2 over Σ I_n²/2. */
export function effectiveAcFactor(sums: AcLossSums, layers: number): number {
  return rippleResistanceWeight(sums, layers) / sums.meanSquare;
}

/** Pdc = Rdc·I² (W). */
export function dcCopperLoss(resistance: number, dcCurrent: number): number {
  return resistance * (dcCurrent * dcCurrent);
}

/** Temperatures at which a wire's harmonic sums are prepared; four keep the interpolation within 0.1 % (temperatures.test.ts). */
export const AC_TEMPERATURE_NODES = 4;

/**
 * Copper temperatures (°C) at which every wire's harmonic sums are prepared once per spec, so the thermal iteration
 * can read the ripple's AC factor at the copper temperature it reached without summing harmonics again. The nodes
 * are Chebyshev points in the Δ scale s(T) = Δ(T)/Δ(Tref) = √(ρ(Tref)/ρ(T)) (δ ∝ √ρ), the variable the Dowell terms
 * depend on smoothly; the values are interpolated by the Lagrange polynomial through them.
 */
export class AcTemperatureGrid {
  readonly temperatures = new Float64Array(AC_TEMPERATURE_NODES);
  readonly scales = new Float64Array(AC_TEMPERATURE_NODES);
  /** Π_{j≠i} (s_i − s_j): the Lagrange denominators. */
  readonly denominators = new Float64Array(AC_TEMPERATURE_NODES);
  constructor(
    /** Temperature (°C) at which a wire's first-harmonic Δ is given. */
    readonly reference: number,
    readonly low: number,
    readonly high: number,
  ) {
    const scaleLow = deltaScale(reference, low);
    const scaleHigh = deltaScale(reference, high);
    for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
      const s = (scaleLow + scaleHigh) / 2 + ((scaleLow - scaleHigh) / 2) * Math.cos(((2 * i + 1) * Math.PI) / (2 * AC_TEMPERATURE_NODES));
      this.scales[i] = s;
      // s² = ρ(Tref)/ρ(T) → ρ(T)/ρ20 = ratio(Tref)/s², T = 20 + (ratio − 1)/α20
      this.temperatures[i] = 20 + (copperResistanceRatio(reference) / (s * s) - 1) / COPPER_TEMPERATURE_COEFFICIENT;
    }
    for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
      let d = 1;
      for (let j = 0; j < AC_TEMPERATURE_NODES; j++) if (j !== i) d *= this.scales[i]! - this.scales[j]!;
      this.denominators[i] = d;
    }
  }
}

/** Δ(T)/Δ(Tref) = √(ρ(Tref)/ρ(T)): skin depth grows as √ρ. */
export function deltaScale(reference: number, temperature: number): number {
  return Math.sqrt(copperResistanceRatio(reference) / copperResistanceRatio(temperature));
}

/** A wire's skin and proximity sums at each node of an AcTemperatureGrid. */
export interface AcLossTable {
  skin: Float64Array;
  proximity: Float64Array;
  /** Σ I_n²/2 (independent of temperature). */
  meanSquare: number;
}

export function acLossTable(deltaAtReference: number, weights: HarmonicWeights, grid: AcTemperatureGrid): AcLossTable {
  const skin = new Float64Array(AC_TEMPERATURE_NODES);
  const proximity = new Float64Array(AC_TEMPERATURE_NODES);
  let meanSquare = 0;
  for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
    const sums = acLossSums(deltaAtReference * grid.scales[i]!, weights);
    skin[i] = sums.skin;
    proximity[i] = sums.proximity;
    meanSquare = sums.meanSquare;
  }
  return { skin, proximity, meanSquare };
}

/** Σ Fr·I_n²/2 for `layers` at every node, written into `out` (length AC_TEMPERATURE_NODES). */
export function rippleWeightNodes(table: AcLossTable, layers: number, out: Float64Array): void {
  const p = proximityFactor(layers);
  for (let i = 0; i < AC_TEMPERATURE_NODES; i++) out[i] = table.skin[i]! + p * table.proximity[i]!;
}

/** The node values interpolated at a copper temperature (clamped to the grid's range). */
export function interpolateAtTemperature(grid: AcTemperatureGrid, nodeValues: Float64Array, temperature: number): number {
  return interpolateAtScale(grid, nodeValues, gridScaleAt(grid, temperature));
}

/** The grid's interpolation variable Δ(T)/Δ(Tref) at a copper temperature (clamped to the grid's range). */
export function gridScaleAt(grid: AcTemperatureGrid, temperature: number): number {
  const t = temperature < grid.low ? grid.low : temperature > grid.high ? grid.high : temperature;
  return deltaScale(grid.reference, t);
}

/** The Lagrange basis L_i(s) of the grid's nodes, into `out`: the value at s of any node table is Σ L_i·v_i (dotBasis). */
export function lagrangeBasis(grid: AcTemperatureGrid, s: number, out: Float64Array): Float64Array {
  for (let i = 0; i < AC_TEMPERATURE_NODES; i++) {
    let l = 1 / grid.denominators[i]!;
    for (let j = 0; j < AC_TEMPERATURE_NODES; j++) if (j !== i) l *= s - grid.scales[j]!;
    out[i] = l;
  }
  return out;
}

/** Σ basis_i·values_i. */
export function dotBasis(basis: Float64Array, values: Float64Array): number {
  let value = 0;
  for (let i = 0; i < AC_TEMPERATURE_NODES; i++) value += basis[i]! * values[i]!;
  return value;
}

/** The node values interpolated at s = gridScaleAt(grid, T): several tables at one temperature share s. */
export function interpolateAtScale(grid: AcTemperatureGrid, nodeValues: Float64Array, s: number): number {
  return dotBasis(lagrangeBasis(grid, s, new Float64Array(AC_TEMPERATURE_NODES)), nodeValues);
}
