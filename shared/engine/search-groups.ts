// The search's bookkeeping: the best feasible build of each core × material × conductor kind × gap placement, the
// simpler-conductor rule that thins them, and the closest miss of each core × material that has no feasible build.
import { CONDUCTOR_TYPES } from './conductor-choice';
import { COPPER_DENSITY } from './constants';
import { describeIssues } from './issues';
import {
  evaluateCandidate,
  turnCopperArea,
  WARNING,
  type CandidateFigures,
  type CoreContext,
  type MaterialContext,
  type SpecContext,
  type WireContext,
} from './kernel';
import { designMagnetics, type MagneticDesign } from './magnetic-design';
import type { InfeasibleCandidate } from './search';
import { GAP_PLACEMENTS, type CoreMaterial, type CoreShape } from './types';

/** A later conductor kind (foil, litz …) is proposed only when it loses this much less than every simpler one. */
export const SIMPLER_CONDUCTOR_PREFERENCE = 0.03;

export function popcount(bits: number): number {
  let count = 0;
  for (let b = bits; b !== 0; b &= b - 1) count++;
  return count;
}

/** The best feasible build found so far of one core × material × conductor kind × gap placement. */
export interface Group {
  core: number;
  material: number;
  conductor: number;
  /** Index into GAP_PLACEMENTS. */
  placement: number;
  turns: number;
  wire: number;
  /** Keep-out of the best build (m). */
  keepOut: number;
  loss: number;
  rise: number;
  extrapolated: boolean;
  /** Its loss leaves out a term the engine does not model (foil beside a gap). */
  lossNotModelled: boolean;
  mass: number;
}

export interface PairState {
  core: number;
  material: number;
  bestFailedWire: number;
  bestFailedTurns: number;
  bestFailedPlacement: number;
  bestFailures: number;
  bestFailedLoss: number;
  feasible: boolean;
}

export function recordFeasible(
  groups: Group[],
  pairGroups: Int32Array,
  at: { c: number; m: number; t: number; turns: number; w: number; placement: number },
  figures: CandidateFigures,
  core: CoreShape,
  material: CoreMaterial,
  wireCtx: WireContext,
): void {
  const slot = at.placement * CONDUCTOR_TYPES.length + at.t;
  let index = pairGroups[slot]!;
  if (index < 0) {
    index = groups.length;
    pairGroups[slot] = index;
    groups.push({
      core: at.c,
      material: at.m,
      conductor: at.t,
      placement: at.placement,
      turns: 0,
      wire: -1,
      keepOut: 0,
      loss: Number.POSITIVE_INFINITY,
      rise: 0,
      extrapolated: false,
      lossNotModelled: false,
      mass: 0,
    });
  }
  const group = groups[index]!;
  if (figures.totalLoss >= group.loss) return;
  group.turns = at.turns;
  group.wire = at.w;
  group.keepOut = figures.keepOut;
  group.loss = figures.totalLoss;
  group.rise = figures.rise;
  group.extrapolated = (figures.warnings & (WARNING.frequencyFit | WARNING.fluxFit)) !== 0;
  group.lossNotModelled = (figures.warnings & WARNING.lossNotModelled) !== 0;
  const copperMass = at.turns * figures.meanTurnLength * turnCopperArea(wireCtx, core) * COPPER_DENSITY;
  group.mass = core.ve * material.density + copperMass;
}

export const SOLID = CONDUCTOR_TYPES.indexOf('solid');
const IN_HAND = CONDUCTOR_TYPES.indexOf('in-hand');
const FOIL = CONDUCTOR_TYPES.indexOf('foil');
const LITZ = CONDUCTOR_TYPES.indexOf('litz');
/** Up to this many turns a foil or strap is easier to wind and terminate than a bundle of wires in hand (common practice, no source). */
export const STRAP_TURNS = 4;

/**
 * A winder reaches for solid wire first, then wires in hand, foil, litz — for a strap of a few turns, foil before
 * wires in hand: a later kind must earn its place by losing clearly less. `pairGroups` holds one placement's kinds.
 */
export function dropNeedlessConductors(groups: Group[], pairGroups: Int32Array): void {
  const foil = pairGroups[FOIL]!;
  const strap = foil >= 0 && groups[foil]!.turns <= STRAP_TURNS;
  const order = strap ? [SOLID, FOIL, IN_HAND, LITZ] : [SOLID, IN_HAND, FOIL, LITZ];
  let simplerBest = Number.POSITIVE_INFINITY;
  for (const t of order) {
    const index = pairGroups[t]!;
    if (index < 0) continue;
    const group = groups[index]!;
    if (group.loss > simplerBest * (1 - SIMPLER_CONDUCTOR_PREFERENCE)) group.turns = 0;
    else simplerBest = Math.min(simplerBest, group.loss);
  }
}

export function explainInfeasible(
  ctx: SpecContext,
  cores: readonly CoreShape[],
  materials: readonly CoreMaterial[],
  coreCtxs: readonly CoreContext[],
  materialCtxs: readonly MaterialContext[],
  wireCtxs: readonly WireContext[],
  pairs: readonly PairState[],
  figures: CandidateFigures,
  limit: number,
): InfeasibleCandidate[] {
  return pairs
    .filter((p) => !p.feasible && p.bestFailedWire >= 0)
    .sort((a, b) => a.bestFailures - b.bestFailures || a.bestFailedLoss - b.bestFailedLoss)
    .slice(0, limit)
    .map((p) => {
      const core = cores[p.core]!;
      const material = materials[p.material]!;
      const placement = GAP_PLACEMENTS[p.bestFailedPlacement]!;
      const mag: MagneticDesign = designMagnetics(core, material, ctx, p.bestFailedTurns, 'auto', placement);
      evaluateCandidate(ctx, coreCtxs[p.core]!, materialCtxs[p.material]!, mag, wireCtxs[p.bestFailedWire]!, figures);
      return {
        coreId: core.id,
        materialId: material.id,
        wireId: wireCtxs[p.bestFailedWire]!.wire.id,
        turns: mag.turns,
        placement,
        totalLoss: figures.totalLoss,
        reasons: describeIssues({ ctx, core, material, mag, figures }).filter((x) => x.severity === 'error'),
      };
    });
}
