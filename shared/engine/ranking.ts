// Ordering of feasible candidates by the designer's chosen objective, and the Pareto fronts drawn beside them.
// Candidates whose core loss rests on extrapolated material data follow every fully modelled in-fit candidate, and
// those whose loss leaves out a term follow both: an extrapolated fit still estimates every loss, a missing term does
// not (the gap field in a foil winding, which the search leaves out — foil-gap-loss.ts is too slow for it — and a field
// check found to be 3–9× the ungapped winding's Rac at 0.5 mm keep-out).
import type { RankBy } from './inputs';

export interface RankedFigures {
  loss: number;
  volume: number;
  mass: number;
  rise: number;
  extrapolated: boolean;
  /** The loss leaves out a term the engine does not model (foil beside a gap). */
  lossNotModelled: boolean;
  /** Conductor kind index, simplest first: the last tie-break. */
  simplicity: number;
}

export const RANK_BY = ['smallest', 'loss', 'temperature', 'balanced'] as const;

function primary(f: RankedFigures, rankBy: RankBy): number {
  switch (rankBy) {
    case 'smallest':
      return f.volume;
    case 'loss':
      return f.loss;
    case 'temperature':
      return f.rise;
    case 'balanced':
      // Loss × volume: halving either is worth the same; neither the biggest core nor the hottest part wins.
      return f.loss * f.volume;
  }
}

/** 0 fully modelled and in fit, 1 extrapolated, 2 a loss term left out. */
const doubt = (f: RankedFigures) => (f.lossNotModelled ? 2 : f.extrapolated ? 1 : 0);

/**
 * Indices of `figures` in rank order: fully modelled in-fit, then extrapolated, then those with a loss term left out;
 * within each, the objective, then loss, volume, simplicity.
 */
export function rankOrder(figures: readonly RankedFigures[], rankBy: RankBy): number[] {
  const key = figures.map((f) => primary(f, rankBy));
  return figures
    .map((_, i) => i)
    .sort(
      (a, b) =>
        doubt(figures[a]!) - doubt(figures[b]!) ||
        key[a]! - key[b]! ||
        figures[a]!.loss - figures[b]!.loss ||
        figures[a]!.volume - figures[b]!.volume ||
        figures[a]!.simplicity - figures[b]!.simplicity,
    );
}

/** Indices on the front of `size` (volume or mass) against loss: no other candidate is both smaller and lower-loss. */
export function paretoFront(figures: readonly RankedFigures[], size: 'volume' | 'mass'): number[] {
  const bySize = figures.map((_, i) => i).sort((a, b) => figures[a]![size] - figures[b]![size] || figures[a]!.loss - figures[b]!.loss);
  const front: number[] = [];
  let bestLoss = Number.POSITIVE_INFINITY;
  for (const i of bySize) {
    // A loss that leaves out a term the engine does not model cannot show what a size costs in loss.
    if (figures[i]!.lossNotModelled) continue;
    if (figures[i]!.loss < bestLoss) {
      front.push(i);
      bestLoss = figures[i]!.loss;
    }
  }
  return front;
}
