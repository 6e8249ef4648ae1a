// Lanczos approximation (g = 7, 9 coefficients), accurate to about 15 significant digits for x > 0.
const LANCZOS_G = 7;
const LANCZOS_COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** ln Γ(x) for x > 0. */
export function logGamma(x: number): number {
  if (x < 0.5) {
    // Reflection keeps the series in its accurate range.
    return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  }
  const z = x - 1;
  let series = LANCZOS_COEFFICIENTS[0]!;
  for (let i = 1; i < LANCZOS_COEFFICIENTS.length; i++) series += LANCZOS_COEFFICIENTS[i]! / (z + i);
  const t = z + LANCZOS_G + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(series);
}

export function gammaFunction(x: number): number {
  return Math.exp(logGamma(x));
}
