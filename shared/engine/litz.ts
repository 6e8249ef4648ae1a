// Litz wire at the strand level. Sullivan and Zhang ("Simplified design method for litz wire", IEEE APEC 2014), after
// Sullivan ("Optimal choice for number of strands in a litz-wire transformer winding", IEEE Trans. Power Electronics
// 14(2), 1999): with strands small against the skin depth, each strand loses π·ω²·μ0²·Ĥ²·d⁴/(128·ρ) per metre in the
// field Ĥ around it, and in a winding of N turns across a window breadth b the field rises linearly to N·Î/b, so
//   Fr = Rac/Rdc = 1 + π²·ω²·μ0²·N²·n²·d⁶ / (768·ρ²·b²)   (n strands of diameter d, the field one-dimensional).
// This replaces counting a bundle as √n Dowell layers. The bundle-level effects of a poorly twisted bundle and the
// strands' own skin effect above d ≈ δ are not in it (the skin term of each strand is kept from Dowell's).
import { MU0 } from './constants';
import type { HarmonicWeights } from './harmonics';

/**
 * Σ_n I_n²/2 · (Fr_n − 1) per N²/b² for the ripple's harmonics (ω_n = n·ω1) of a litz of `strands` strands of
 * `strandDiameter` at resistivity ρ: times N²/b² it is the proximity part of the ripple's weight Σ I_n²/2·Fr_n (A²·m²).
 */
export function litzProximitySum(
  strands: number,
  strandDiameter: number,
  resistivity: number,
  frequency: number,
  weights: Pick<HarmonicWeights, 'meanSquare'>,
): number {
  const omega = 2 * Math.PI * frequency;
  const coefficient = (Math.PI ** 2 * omega ** 2 * MU0 ** 2 * strands ** 2 * strandDiameter ** 6) / (768 * resistivity ** 2);
  let sum = 0;
  for (let n = 1; n <= weights.meanSquare.length; n++) sum += weights.meanSquare[n - 1]! * n * n;
  return coefficient * sum;
}

/** N²/b²: what turns litzProximitySum into the proximity weight of N turns across a winding breadth b (1/m²). */
export function litzWindingFactor(turns: number, breadth: number): number {
  return (turns * turns) / (breadth * breadth);
}

/** Rac/Rdc of a sinusoid at `frequency` by the same formula (for one harmonic; the engine sums the ripple's). */
export function litzAcFactor(
  strands: number,
  strandDiameter: number,
  turns: number,
  breadth: number,
  resistivity: number,
  frequency: number,
): number {
  const omega = 2 * Math.PI * frequency;
  return (
    1 + (Math.PI ** 2 * omega ** 2 * MU0 ** 2 * turns ** 2 * strands ** 2 * strandDiameter ** 6) / (768 * resistivity ** 2 * breadth ** 2)
  );
}
