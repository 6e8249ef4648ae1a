import { MU0 } from './constants';
import type { RollOffFit } from './types';

/** Zero-bias AL of an ungapped (distributed-gap) toroid: μ0·μi·Ae/le (H/turn²). */
export function powderInductanceFactor(permeability: number, area: number, pathLength: number): number {
  return (MU0 * permeability * area) / pathLength;
}

/** μ%(H) = 1/(a + b·H^c) as a fraction of μi, H in A/m; no fit means no roll-off. */
export function permeabilityFraction(rollOff: RollOffFit | undefined, field: number): number {
  if (!rollOff) return 1;
  return 1 / (rollOff.a + rollOff.b * Math.pow(Math.abs(field), rollOff.c));
}

/**
 * Incremental inductance L(N, I) = AL·N²·μ%(N·I/le) = dλ/dI of the flux linkage λ = N·Ae·B(N·I/le) (biasedFlux):
 * what the ripple sees at bias I. The flux itself is not L·I/(N·Ae); use biasedFlux.
 */
export function biasedInductance(
  turns: number,
  current: number,
  inductanceFactor: number,
  pathLength: number,
  rollOff: RollOffFit | undefined,
): number {
  return inductanceFactor * turns * turns * permeabilityFraction(rollOff, (turns * current) / pathLength);
}

export interface PowderTurnsResult {
  /** Smallest N meeting the target at the bias current, or the last N tried when infeasible. */
  turns: number;
  feasible: boolean;
  /** 'L-maximum' when more turns stop raising L (deep roll-off); 'turn-limit' when N exceeded maxTurns. */
  reason?: 'L-maximum' | 'turn-limit';
  inductanceAtBias: number;
}

/**
 * Turns for a target L at bias current I: start at ceil(sqrt(L/AL)), step N ← max(N + 1, ceil(sqrt(L/(AL·μ%))))
 * until met, then step back to the smallest N that still meets it (the update can overshoot).
 */
export function powderTurns(
  targetInductance: number,
  biasCurrent: number,
  inductanceFactor: number,
  pathLength: number,
  rollOff: RollOffFit | undefined,
  maxTurns: number,
): PowderTurnsResult {
  const inductanceAt = (n: number) => biasedInductance(n, biasCurrent, inductanceFactor, pathLength, rollOff);
  let turns = Math.max(1, Math.ceil(Math.sqrt(targetInductance / inductanceFactor) - 1e-9));
  let inductance = inductanceAt(turns);
  while (inductance < targetInductance) {
    const fraction = inductance / (inductanceFactor * turns * turns);
    let next = Math.max(turns + 1, Math.ceil(Math.sqrt(targetInductance / (inductanceFactor * fraction)) - 1e-9));
    if (next > maxTurns) next = turns + 1;
    if (next > maxTurns) return { turns, feasible: false, reason: 'turn-limit', inductanceAtBias: inductance };
    let nextInductance = inductanceAt(next);
    if (nextInductance <= inductance && next > turns + 1) {
      // The jump may have crossed the maximum of L(N); walk one turn instead.
      next = turns + 1;
      nextInductance = inductanceAt(next);
    }
    if (nextInductance <= inductance) return { turns, feasible: false, reason: 'L-maximum', inductanceAtBias: inductance };
    turns = next;
    inductance = nextInductance;
  }
  while (turns > 1) {
    const fewer = inductanceAt(turns - 1);
    if (fewer < targetInductance) break;
    turns -= 1;
    inductance = fewer;
  }
  return { turns, feasible: true, inductanceAtBias: inductance };
}

// 16-point Gauss–Legendre on [−1, 1]: the positive nodes and their weights (Abramowitz & Stegun, Handbook of
// Mathematical Functions, Table 25.4); the negative nodes mirror them.
const GL_NODES = [
  0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438, 0.755404408355003, 0.8656312023878318, 0.9445750230732326,
  0.9894009349916499,
] as const;
const GL_WEIGHTS = [
  0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165768, 0.1246289712555339, 0.0951585116824928,
  0.0622535239386479, 0.0271524594117541,
] as const;
/** Longest stretch of ln h one 16-point rule covers beyond the knee, and the most stretches taken. */
const TAIL_SEGMENT = 2;
const TAIL_MAX_SEGMENTS = 32;

/** ∫₀^X dh/(a + b·h^c) with h = X·t^q, t ∈ [0, 1]; q = max(2, 3/c) makes the integrand in t smooth at t = 0. */
function kneeIntegral(r: RollOffFit, upper: number): number {
  const q = Math.max(2, 3 / r.c);
  let sum = 0;
  for (let i = 0; i < GL_NODES.length; i++) {
    for (let side = -1; side <= 1; side += 2) {
      const t = (1 + side * GL_NODES[i]!) / 2;
      const tq1 = Math.pow(t, q - 1);
      const h = upper * tq1 * t;
      sum += (GL_WEIGHTS[i]! * q * tq1) / (r.a + r.b * Math.pow(h, r.c));
    }
  }
  return (sum * upper) / 2;
}

/** ∫ from h0 to h1 of dh/(a + b·h^c) with h = h0·e^s: smooth in s, in stretches of at most TAIL_SEGMENT. */
function tailIntegral(r: RollOffFit, from: number, to: number): number {
  const span = Math.log(to / from);
  const segments = Math.min(TAIL_MAX_SEGMENTS, Math.max(1, Math.ceil(span / TAIL_SEGMENT)));
  const width = span / segments;
  let sum = 0;
  for (let k = 0; k < segments; k++) {
    for (let i = 0; i < GL_NODES.length; i++) {
      for (let side = -1; side <= 1; side += 2) {
        const h = from * Math.exp(width * (k + (1 + side * GL_NODES[i]!) / 2));
        sum += (GL_WEIGHTS[i]! * h) / (r.a + r.b * Math.pow(h, r.c));
      }
    }
  }
  return (sum * width) / 2;
}

/**
 * ∫₀^H μ%(h) dh (A/m) for μ% = 1/(a + b·h^c). A roll-off curve gives the incremental permeability (IEC 60050-221,
 * "incremental permeability": the slope of B(H) at a bias), so the flux at bias H is B = μ0·μi·∫₀^H μ%(h) dh, not
 * μ0·μi·μ%(H)·H. Fixed-order Gauss–Legendre, split at the knee hk = (a/b)^(1/c) (where μ% has halved for a = 1);
 * no allocation. Agrees with the closed forms for c = 1 (ln) and c = 2 (arctan) to ~1e-13.
 */
export function rollOffIntegral(rollOff: RollOffFit | undefined, field: number): number {
  const h = Math.abs(field);
  if (!rollOff) return h;
  if (h === 0) return 0;
  if (!(rollOff.b > 0)) return h / rollOff.a;
  const knee = Math.pow(rollOff.a / rollOff.b, 1 / rollOff.c);
  if (h <= knee) return kneeIntegral(rollOff, h);
  return kneeIntegral(rollOff, knee) + tailIntegral(rollOff, knee, h);
}

/** Core flux of a distributed-gap core at current I: B = μ0·μi·∫₀^(N·I/le) μ%(h) dh (T). */
export function biasedFlux(
  turns: number,
  current: number,
  permeability: number,
  pathLength: number,
  rollOff: RollOffFit | undefined,
): number {
  return MU0 * permeability * rollOffIntegral(rollOff, (turns * current) / pathLength);
}
