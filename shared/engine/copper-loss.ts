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
