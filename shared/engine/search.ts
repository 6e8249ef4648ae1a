import { availableAreaProduct, requiredAreaProduct } from './area-product';
import { ConductorChooser, CONDUCTOR_TYPES, type ConductorType } from './conductor-choice';
import { COPPER_DENSITY } from './constants';
import { assembleResult, type EvaluationResult } from './evaluate';
import type { ConverterSpec, DesignLimits, EngineIssue, RankBy } from './inputs';
import { describeIssues } from './issues';
import {
  CandidateFigures,
  designMagnetics,
  evaluateCandidate,
  prepareCore,
  prepareMaterial,
  prepareSpec,
  prepareWires,
  turnCopperArea,
  windowTurnLimit,
  WARNING,
  type CoreContext,
  type MagneticDesign,
  type MaterialContext,
  type SpecContext,
  type WireContext,
} from './kernel';
import { paretoFront, rankOrder, type RankedFigures } from './ranking';
import type { CoreMaterial, CoreShape, WireOption } from './types';

/** Cores whose area product is below this fraction of the requirement are reported, not evaluated. */
export const AREA_PRODUCT_PREFILTER = 0.5;
/** A later conductor kind (foil, litz …) is proposed only when it loses this much less than every simpler one. */
export const SIMPLER_CONDUCTOR_PREFERENCE = 0.03;
/** The turns sweep stops after this many steps in a row without a new lowest loss. */
const TURNS_STEPS_WITHOUT_GAIN = 3;
/** Above this many turns the sweep steps geometrically (a few per cent per step), not one turn at a time. */
const TURNS_GEOMETRIC_FROM = 20;
const TURNS_GEOMETRIC_STEP = 1.05;

export interface SearchInput {
  spec: ConverterSpec;
  limits?: Partial<DesignLimits>;
  cores: readonly CoreShape[];
  materials: readonly CoreMaterial[];
  /** Round wire, litz and foil options; the search picks from them per core and turns. */
  wires: readonly WireOption[];
  /** What "best" means (default: the smallest part that meets every limit). */
  rankBy?: RankBy;
  /** Page of the ranked list to return: first rank (0-based) and how many (default 0 and 20). */
  offset?: number;
  limit?: number;
  /** Infeasible core × material pairs to explain, closest to feasible first (default 30); every prefiltered core follows. */
  infeasibleLimit?: number;
}

export interface SearchCandidate {
  rank: number;
  /** On the loss-versus-core-volume Pareto front of all feasible candidates. */
  pareto: boolean;
  /** On the loss-versus-mass Pareto front. */
  paretoByMass: boolean;
  /** Core loss rests on Steinmetz coefficients used outside their fitted frequency or flux range. */
  extrapolated: boolean;
  conductor: ConductorType;
  /** Core volume Ve (m³) and the part's mass, core plus copper (kg). */
  volume: number;
  mass: number;
  /** The wire option as evaluated. */
  wire: WireOption;
  result: EvaluationResult;
}

export interface InfeasibleCandidate {
  coreId: string;
  materialId?: string;
  wireId?: string;
  turns?: number;
  totalLoss?: number;
  reasons: EngineIssue[];
}

export interface SearchResult {
  rankBy: RankBy;
  /** One page of the ranked candidates. */
  candidates: SearchCandidate[];
  page: { offset: number; limit: number; total: number };
  /** The whole Pareto front, loss versus core volume, smallest core first. */
  paretoFront: SearchCandidate[];
  /** The whole Pareto front, loss versus mass, lightest first. */
  paretoFrontByMass: SearchCandidate[];
  infeasible: InfeasibleCandidate[];
  counts: {
    cores: number;
    materials: number;
    wireOptions: number;
    /** Candidate evaluations made (core × material × turns × conductor). */
    evaluated: number;
    /** Feasible candidates: the best build of each core × material × conductor kind that meets every limit. */
    feasible: number;
    /** Of those, how many rest on extrapolated loss data (ranked after every in-fit candidate). */
    extrapolated: number;
    prefiltered: number;
    incompatible: number;
  };
  requiredAreaProduct: number;
}

/**
 * Air-gap cores take gapped (non-powder) materials; powder toroids take powder materials; plain rings take the
 * non-powder materials they are sold in (ungapped).
 */
export function compatible(core: CoreShape, material: CoreMaterial): boolean {
  const isPowder = material.family === 'powder';
  if (core.family === 'POWDER_TOROID') return isPowder;
  return !isPowder;
}

const cm4 = (m4: number) => (m4 * 1e8).toFixed(2);

function popcount(bits: number): number {
  let count = 0;
  for (let b = bits; b !== 0; b &= b - 1) count++;
  return count;
}

const nextTurns = (turns: number) => (turns < TURNS_GEOMETRIC_FROM ? turns + 1 : Math.ceil(turns * TURNS_GEOMETRIC_STEP));

/** The best feasible build found so far of one core × material × conductor kind. */
interface Group {
  core: number;
  material: number;
  conductor: number;
  turns: number;
  wire: number;
  loss: number;
  rise: number;
  extrapolated: boolean;
  mass: number;
}

interface PairState {
  core: number;
  material: number;
  bestFailedWire: number;
  bestFailedTurns: number;
  bestFailures: number;
  bestFailedLoss: number;
  feasible: boolean;
}

export function searchCandidates(input: SearchInput): SearchResult {
  const rankBy = input.rankBy ?? 'smallest';
  const ctx = prepareSpec(input.spec, input.limits);
  const { op, limits } = ctx;
  const cores = limits.allowedFamilies ? input.cores.filter((c) => limits.allowedFamilies!.includes(c.family)) : input.cores;
  const materials = limits.allowedMaterials ? input.materials.filter((m) => limits.allowedMaterials!.includes(m.id)) : input.materials;

  const required = requiredAreaProduct(
    op.inductanceNominal,
    op.saturationCheckCurrent,
    op.rmsCurrent,
    limits.bMax,
    limits.currentDensity,
    limits.windowUtilisation,
  );
  const wireCtxs: WireContext[] = prepareWires(input.wires, ctx);
  const chooser = new ConductorChooser(ctx, wireCtxs);
  const materialCtxs: MaterialContext[] = materials.map((m) => prepareMaterial(m, ctx));
  const coreCtxs: CoreContext[] = cores.map(prepareCore);
  const figures = new CandidateFigures();

  const groups: Group[] = [];
  const pairs: PairState[] = [];
  const prefilteredCores: InfeasibleCandidate[] = [];
  let evaluated = 0;
  let prefiltered = 0;
  let incompatible = 0;

  for (let c = 0; c < cores.length; c++) {
    const core = cores[c]!;
    const available = availableAreaProduct(core);
    if (available < AREA_PRODUCT_PREFILTER * required) {
      prefiltered++;
      prefilteredCores.push({
        coreId: core.id,
        reasons: [
          { code: 'area-product', severity: 'error', message: `Area product ${cm4(available)} cm⁴ < required ${cm4(required)} cm⁴.` },
        ],
      });
      continue;
    }
    const turnLimit = windowTurnLimit(core, ctx);
    for (let m = 0; m < materials.length; m++) {
      const material = materials[m]!;
      if (!compatible(core, material)) {
        incompatible++;
        continue;
      }
      const pair: PairState = {
        core: c,
        material: m,
        bestFailedWire: -1,
        bestFailedTurns: 0,
        bestFailures: 0,
        bestFailedLoss: Number.POSITIVE_INFINITY,
        feasible: false,
      };
      pairs.push(pair);
      const pairGroups = new Int32Array(CONDUCTOR_TYPES.length).fill(-1);
      const first = designMagnetics(core, material, ctx);
      let lowest = Number.POSITIVE_INFINITY;
      let withoutGain = 0;
      for (let turns = first.turns; ; turns = nextTurns(turns)) {
        const mag = turns === first.turns ? first : designMagnetics(core, material, ctx, turns);
        const choice = chooser.best(core, c, turns);
        let stepLowest = Number.POSITIVE_INFINITY;
        let anyWire = false;
        for (let t = 0; t < CONDUCTOR_TYPES.length; t++) {
          const w = choice[t]!;
          if (w < 0) continue;
          anyWire = true;
          evaluated++;
          const feasible = evaluateCandidate(ctx, coreCtxs[c]!, materialCtxs[m]!, mag, wireCtxs[w]!, figures);
          if (figures.totalLoss < stepLowest) stepLowest = figures.totalLoss;
          if (feasible) {
            pair.feasible = true;
            recordFeasible(groups, pairGroups, { c, m, t, turns, w }, figures, core, material, wireCtxs[w]!);
          } else if (!pair.feasible) {
            const count = popcount(figures.failures);
            if (
              pair.bestFailedWire < 0 ||
              count < pair.bestFailures ||
              (count === pair.bestFailures && figures.totalLoss < pair.bestFailedLoss)
            ) {
              pair.bestFailedWire = w;
              pair.bestFailedTurns = turns;
              pair.bestFailures = count;
              pair.bestFailedLoss = figures.totalLoss;
            }
          }
        }
        // Distributed-gap cores: the turns follow from the inductance. Gapped: more turns until the loss rises for good.
        if (mag.kind === 'distributed' || !anyWire || turns >= turnLimit) break;
        if (stepLowest < lowest * (1 - 1e-9)) {
          lowest = stepLowest;
          withoutGain = 0;
        } else if (++withoutGain >= TURNS_STEPS_WITHOUT_GAIN) break;
      }
      dropNeedlessConductors(groups, pairGroups);
    }
  }

  const kept = groups.filter((g) => g.turns > 0);
  const ranked: RankedFigures[] = kept.map((g) => ({
    loss: g.loss,
    volume: cores[g.core]!.ve,
    mass: g.mass,
    rise: g.rise,
    extrapolated: g.extrapolated,
    simplicity: g.conductor,
  }));
  const order = rankOrder(ranked, rankBy);
  const rankOf = new Int32Array(kept.length);
  order.forEach((i, position) => (rankOf[i] = position + 1));
  const onVolumeFront = new Set(paretoFront(ranked, 'volume'));
  const onMassFront = new Set(paretoFront(ranked, 'mass'));

  const build = (i: number): SearchCandidate => {
    const g = kept[i]!;
    const core = cores[g.core]!;
    const material = materials[g.material]!;
    const mag = designMagnetics(core, material, ctx, g.turns);
    const wireCtx = wireCtxs[g.wire]!;
    evaluateCandidate(ctx, coreCtxs[g.core]!, materialCtxs[g.material]!, mag, wireCtx, figures);
    return {
      rank: rankOf[i]!,
      pareto: onVolumeFront.has(i),
      paretoByMass: onMassFront.has(i),
      extrapolated: g.extrapolated,
      conductor: CONDUCTOR_TYPES[g.conductor]!,
      volume: core.ve,
      mass: g.mass,
      wire: wireCtx.wire,
      result: assembleResult(ctx, core, material, mag, wireCtx, figures),
    };
  };
  const offset = Math.max(0, input.offset ?? 0);
  const limit = input.limit ?? 20;
  const candidates = order.slice(offset, offset + limit).map(build);
  const byVolume = (a: number, b: number) => ranked[a]!.volume - ranked[b]!.volume || ranked[a]!.loss - ranked[b]!.loss;
  const byMass = (a: number, b: number) => ranked[a]!.mass - ranked[b]!.mass || ranked[a]!.loss - ranked[b]!.loss;

  return {
    rankBy,
    candidates,
    page: { offset, limit, total: kept.length },
    paretoFront: [...onVolumeFront].sort(byVolume).map(build),
    paretoFrontByMass: [...onMassFront].sort(byMass).map(build),
    infeasible: [
      ...explainInfeasible(ctx, cores, materials, coreCtxs, materialCtxs, wireCtxs, pairs, figures, input.infeasibleLimit ?? 30),
      ...prefilteredCores,
    ],
    counts: {
      cores: cores.length,
      materials: materials.length,
      wireOptions: wireCtxs.length,
      evaluated,
      feasible: kept.length,
      extrapolated: kept.filter((g) => g.extrapolated).length,
      prefiltered,
      incompatible,
    },
    requiredAreaProduct: required,
  };
}

function recordFeasible(
  groups: Group[],
  pairGroups: Int32Array,
  at: { c: number; m: number; t: number; turns: number; w: number },
  figures: CandidateFigures,
  core: CoreShape,
  material: CoreMaterial,
  wireCtx: WireContext,
): void {
  let index = pairGroups[at.t]!;
  if (index < 0) {
    index = groups.length;
    pairGroups[at.t] = index;
    groups.push({
      core: at.c,
      material: at.m,
      conductor: at.t,
      turns: 0,
      wire: -1,
      loss: Number.POSITIVE_INFINITY,
      rise: 0,
      extrapolated: false,
      mass: 0,
    });
  }
  const group = groups[index]!;
  if (figures.totalLoss >= group.loss) return;
  group.turns = at.turns;
  group.wire = at.w;
  group.loss = figures.totalLoss;
  group.rise = figures.rise;
  group.extrapolated = (figures.warnings & (WARNING.frequencyFit | WARNING.fluxFit)) !== 0;
  const copperMass = at.turns * figures.meanTurnLength * turnCopperArea(wireCtx, core) * COPPER_DENSITY;
  group.mass = core.ve * material.density + copperMass;
}

const SOLID = CONDUCTOR_TYPES.indexOf('solid');
const IN_HAND = CONDUCTOR_TYPES.indexOf('in-hand');
const FOIL = CONDUCTOR_TYPES.indexOf('foil');
const LITZ = CONDUCTOR_TYPES.indexOf('litz');
/** Up to this many turns a foil or strap is easier to wind and terminate than a bundle of wires in hand (common practice, no source). */
export const STRAP_TURNS = 4;

/**
 * A winder reaches for solid wire first, then wires in hand, foil, litz — for a strap of a few turns, foil before
 * wires in hand: a later kind must earn its place by losing clearly less.
 */
function dropNeedlessConductors(groups: Group[], pairGroups: Int32Array): void {
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

function explainInfeasible(
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
      const mag: MagneticDesign = designMagnetics(core, material, ctx, p.bestFailedTurns);
      evaluateCandidate(ctx, coreCtxs[p.core]!, materialCtxs[p.material]!, mag, wireCtxs[p.bestFailedWire]!, figures);
      return {
        coreId: core.id,
        materialId: material.id,
        wireId: wireCtxs[p.bestFailedWire]!.wire.id,
        turns: mag.turns,
        totalLoss: figures.totalLoss,
        reasons: describeIssues({ ctx, core, material, mag, figures }).filter((x) => x.severity === 'error'),
      };
    });
}
