import { FRINGING_VALIDITY_LIMIT, MU0 } from './constants';

/** Turns from the flux limit: N = ceil(L·Ipk/(Bmax·Ae)). */
export function turnsForFluxLimit(inductance: number, peakCurrent: number, bMax: number, area: number): number {
  // The small allowance keeps an exact integer from rounding up through floating-point noise.
  return Math.max(1, Math.ceil((inductance * peakCurrent) / (bMax * area) - 1e-9));
}

/** Total gap without fringing: lg = μ0·N²·Ae/L − le/μr (negative: the core cannot reach L with N turns). */
export function gapWithoutFringing(turns: number, inductance: number, area: number, pathLength: number, permeability: number): number {
  return (MU0 * turns * turns * area) / inductance - pathLength / permeability;
}

/** McLyman's fringing factor F = 1 + (lg/√Ae)·ln(2G/lg), never below 1. */
export function fringingFactor(gap: number, area: number, windowHeight: number): number {
  if (gap <= 0) return 1;
  return Math.max(1, 1 + (gap / Math.sqrt(area)) * Math.log((2 * windowHeight) / gap));
}

/** L = μ0·N²·Ae·F/(lg + le/μr). */
export function gappedInductance(
  turns: number,
  gap: number,
  area: number,
  pathLength: number,
  permeability: number,
  windowHeight: number,
  withFringing = true,
): number {
  const f = withFringing ? fringingFactor(gap, area, windowHeight) : 1;
  return (MU0 * turns * turns * area * f) / (Math.max(gap, 0) + pathLength / permeability);
}

/** AL = μ0·Ae·F/(lg + le/μr) (H/turn²). */
export function gappedInductanceFactor(
  gap: number,
  area: number,
  pathLength: number,
  permeability: number,
  windowHeight: number,
  withFringing: boolean,
): number {
  return gappedInductance(1, gap, area, pathLength, permeability, windowHeight, withFringing);
}

export interface GapGeometry {
  area: number;
  pathLength: number;
  windowHeight: number;
  permeability: number;
}

const GAP_TOLERANCE = 1e-9;
const MAX_NEWTON_STEPS = 200;

/** What `rootOfRising`'s `evaluate` writes: the function's value and slope at the point asked for. */
const newtonStep = { residual: 0, slope: 0 };

/**
 * Root of a rising function from a start at or below it: Newton steps kept inside the bracket found so far, halving
 * it (or doubling the point while no upper bound is known) whenever a step would leave it.
 */
function rootOfRising(start: number, evaluate: (x: number) => void): number {
  let low = start;
  let high = Number.POSITIVE_INFINITY;
  let x = start;
  for (let step = 0; step < MAX_NEWTON_STEPS; step++) {
    evaluate(x);
    if (newtonStep.residual < 0) low = x;
    else high = x;
    let next = newtonStep.slope > 0 ? x - newtonStep.residual / newtonStep.slope : Number.NaN;
    if (!(next > low && next < high)) next = high < Number.POSITIVE_INFINITY ? (low + high) / 2 : 2 * x;
    if (Math.abs(next - x) <= GAP_TOLERANCE * next) return next;
    x = next;
  }
  return x;
}

/**
 * Keep N and widen the gap until L is met with fringing: lg = μ0·N²·Ae·F(lg)/L − le/μr, solved by Newton's method
 * on h(lg) = μ0·N²·Ae·F(lg)/L − le/μr − lg (F′ = (ln(2G/lg) − 1)/√Ae), kept inside a bracket that bisects whenever
 * a step would leave it. Starts from the unfringed gap, where h ≥ 0 since F ≥ 1.
 */
export function gapWithFringing(turns: number, inductance: number, g: GapGeometry): number {
  const start = gapWithoutFringing(turns, inductance, g.area, g.pathLength, g.permeability);
  if (start <= 0) return start;
  const numerator = (MU0 * turns * turns * g.area) / inductance;
  const reluctanceLength = g.pathLength / g.permeability;
  const root = Math.sqrt(g.area);
  const twiceWindow = 2 * g.windowHeight;
  // −h rises with lg near the root and is ≤ 0 at the start; the bracket keeps the steps safe elsewhere.
  return rootOfRising(start, (gap) => {
    const logRatio = Math.log(twiceWindow / gap);
    const f = 1 + (gap / root) * logRatio;
    newtonStep.residual = gap + reluctanceLength - numerator * (f > 1 ? f : 1);
    newtonStep.slope = 1 - (f > 1 ? (numerator * (logRatio - 1)) / root : 0);
  });
}

/** Turns for a given gap with fringing: N = sqrt(L·(lg + le/μr)/(μ0·Ae·F)), rounded up. */
export function turnsForGap(inductance: number, gap: number, g: GapGeometry): number {
  const f = fringingFactor(gap, g.area, g.windowHeight);
  const exact = Math.sqrt((inductance * (Math.max(gap, 0) + g.pathLength / g.permeability)) / (MU0 * g.area * f));
  return Math.max(1, Math.ceil(exact - 1e-9));
}

/** Smallest N for which an ungapped core reaches L (below it the required gap is negative). */
export function minimumTurnsUngapped(inductance: number, g: GapGeometry): number {
  return Math.max(1, Math.ceil(Math.sqrt((inductance * g.pathLength) / (MU0 * g.permeability * g.area)) - 1e-9));
}

export function fringingOutOfRange(gap: number, area: number): boolean {
  return gap / Math.sqrt(area) > FRINGING_VALIDITY_LIMIT;
}

/**
 * A spacer of thickness t under all legs makes two gaps in series: t across the centre leg (area Ae) and t across
 * the outer legs (together Ao = Ae/(Ac/Ao)). Each gap's permeance is enlarged by McLyman's fringing factor of its
 * own leg area, F(t, A) = 1 + (t/√A)·ln(2G/t) (Transformer and Inductor Design Handbook, 3rd ed., ch. 8); the core
 * path keeps le/(μr·Ae). Returns ΣR·μ0 in 1/m: L = μ0·N²/(that).
 */
function spacerReluctanceLength(spacer: number, g: GapGeometry, centreToOuterLegAreaRatio: number): number {
  const outer = g.area / centreToOuterLegAreaRatio;
  const t = Math.max(spacer, 0);
  const core = g.pathLength / (g.permeability * g.area);
  if (t === 0) return core;
  return core + t / (g.area * fringingFactor(t, g.area, g.windowHeight)) + t / (outer * fringingFactor(t, outer, g.windowHeight));
}

/** L of N turns with a spacer t under all legs (two fringing gaps in series, see spacerReluctanceLength). */
export function spacerInductance(turns: number, spacer: number, g: GapGeometry, centreToOuterLegAreaRatio = 1): number {
  return (MU0 * turns * turns) / spacerReluctanceLength(spacer, g, centreToOuterLegAreaRatio);
}

/** The same without fringing: t·(1/Ae + 1/Ao) is an equivalent single gap of t·(1 + Ac/Ao) across Ae. */
export function spacerEquivalentGap(spacer: number, centreToOuterLegAreaRatio = 1): number {
  return spacer * (1 + centreToOuterLegAreaRatio);
}

/**
 * Spacer thickness giving L with N turns. The reluctance R(t) rises monotonically (t/F(t) rises: its derivative is
 * (1 + t/√A)/F² > 0), so Newton's method on μ0·R(t) − μ0·N²/L, with (t/F)′ = (F − t·F′)/F² per leg, converges
 * from the unfringed thickness (where R ≤ the target, F ≥ 1); a step that leaves the bracket bisects instead.
 * Negative: the ungapped core cannot reach L with N turns.
 */
export function spacerForInductance(turns: number, inductance: number, g: GapGeometry, centreToOuterLegAreaRatio = 1): number {
  const unfringed = gapWithoutFringing(turns, inductance, g.area, g.pathLength, g.permeability) / (1 + centreToOuterLegAreaRatio);
  if (unfringed <= 0) return unfringed;
  const target = (MU0 * turns * turns) / inductance;
  const core = g.pathLength / (g.permeability * g.area);
  const outer = g.area / centreToOuterLegAreaRatio;
  const rootCentre = Math.sqrt(g.area);
  const rootOuter = Math.sqrt(outer);
  const twiceWindow = 2 * g.windowHeight;
  return rootOfRising(unfringed, (t) => {
    const logRatio = Math.log(twiceWindow / t);
    const fc = 1 + (t / rootCentre) * logRatio;
    const fo = 1 + (t / rootOuter) * logRatio;
    const centre = fc > 1 ? fc : 1;
    const outerF = fo > 1 ? fo : 1;
    newtonStep.residual = core + t / (g.area * centre) + t / (outer * outerF) - target;
    const dCentre = fc > 1 ? (centre - (t * (logRatio - 1)) / rootCentre) / (g.area * centre * centre) : 1 / g.area;
    const dOuter = fo > 1 ? (outerF - (t * (logRatio - 1)) / rootOuter) / (outer * outerF * outerF) : 1 / outer;
    newtonStep.slope = dCentre + dOuter;
  });
}

/** Turns for a given spacer: N = sqrt(L·ΣR/μ0), rounded up. */
export function turnsForSpacer(inductance: number, spacer: number, g: GapGeometry, centreToOuterLegAreaRatio = 1): number {
  const exact = Math.sqrt((inductance * spacerReluctanceLength(spacer, g, centreToOuterLegAreaRatio)) / MU0);
  return Math.max(1, Math.ceil(exact - 1e-9));
}
