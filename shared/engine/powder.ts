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

/** L(N, I) = AL·N²·μ%(N·I/le). */
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
