// The exact skin effect of an isolated straight round wire: its internal impedance per length is
// Z = k·J0(k·a)/(2π·a·σ·J1(k·a)) with k = (1 − j)/δ (S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in
// Communication Electronics, Wiley, the round wire's internal impedance — from memory), so
// R_ac/R_dc = Re[(k·a/2)·J0(k·a)/J1(k·a)]. J0 and J1 of the complex argument are summed from their power series,
// which stay accurate to a few parts in 1e12 for a/δ up to about 10 (the terms grow to ~e^(a/δ) before cancelling).

type Complex = [number, number];
const mul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: Complex, b: Complex): Complex => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/** J_order(x) for order 0 or 1 by the power series Σ (−1)^m (x/2)^(2m+order) / (m!·(m+order)!). */
export function besselJ(order: 0 | 1, x: Complex): Complex {
  const half: Complex = [x[0] / 2, x[1] / 2];
  const quarterSquare = mul(half, half);
  let term: Complex = order === 0 ? [1, 0] : half;
  let sum: Complex = term;
  for (let m = 1; m < 200; m++) {
    term = mul(term, quarterSquare);
    const scale = -1 / (m * (m + order));
    term = [term[0] * scale, term[1] * scale];
    sum = [sum[0] + term[0], sum[1] + term[1]];
    if (Math.hypot(...term) < 1e-17 * Math.hypot(...sum)) break;
  }
  return sum;
}

/** R_ac/R_dc of an isolated round wire of radius a at skin depth δ. */
export function roundWireResistanceRatio(radius: number, skinDepth: number): number {
  if (radius / skinDepth > 12) throw new RangeError('The series is not trusted beyond a/δ = 12.');
  const ka: Complex = [radius / skinDepth, -radius / skinDepth];
  const ratio = div(besselJ(0, ka), besselJ(1, ka));
  return mul([ka[0] / 2, ka[1] / 2], ratio)[0];
}
