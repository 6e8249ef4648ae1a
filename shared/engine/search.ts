import { availableAreaProduct, requiredAreaProduct } from './area-product';
import { ConductorChooser, CONDUCTOR_TYPES, type ConductorType } from './conductor-choice';
import { assembleResult, type EvaluationResult } from './evaluate';
import type { ConverterSpec, DesignLimits, EngineIssue, RankBy } from './inputs';
import {
  applyMagnetics,
  CandidateFigures,
  buildFitsWithKeepOut,
  copyWindingLosses,
  evaluateCandidate,
  evaluateWindingLosses,
  FAILURE,
  gapLossScale,
  layOutWinding,
  lossFloor,
  prepareCore,
  prepareMaterial,
  prepareSpec,
  prepareWires,
  type CoreContext,
  type MaterialContext,
  type SpecContext,
  type WireContext,
} from './kernel';
import { designMagnetics, windowTurnLimit, type MagneticDesign } from './magnetic-design';
import { paretoFront, rankOrder, type RankedFigures } from './ranking';
import {
  dropNeedlessConductors,
  explainInfeasible,
  popcount,
  recordFeasible,
  SIMPLER_CONDUCTOR_PREFERENCE,
  SOLID,
  type Group,
  type PairState,
} from './search-groups';
import { GAP_PLACEMENTS, type CoreMaterial, type CoreShape, type GapPlacement, type WireOption } from './types';

/** Cores whose area product is below this fraction of the requirement are reported, not evaluated. */
export const AREA_PRODUCT_PREFILTER = 0.5;
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
  /** Solve every build, the ones the loss floor shows can change nothing too (the tests' reference; slower). */
  solveEveryBuild?: boolean;
}

export interface SearchCandidate {
  rank: number;
  /** On the loss-versus-core-volume Pareto front of all feasible candidates. */
  pareto: boolean;
  /** On the loss-versus-mass Pareto front. */
  paretoByMass: boolean;
  /** Core loss rests on Steinmetz coefficients used outside their fitted frequency or flux range. */
  extrapolated: boolean;
  /** Its loss leaves out a term the engine does not model (foil beside a gap): ranked after the fully modelled ones. */
  lossNotModelled: boolean;
  conductor: ConductorType;
  /** Where the gap is made ('ground' for distributed-gap cores); also in result.gap.placement. */
  placement: GapPlacement;
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
  placement?: GapPlacement;
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
    /** Candidate evaluations made (core × material × turns × conductor × gap placement). */
    evaluated: number;
    /**
     * Candidates left unsolved because their loss floor showed they could change nothing: neither the best build of
     * their kind nor the turns sweep's lowest loss, nor keep their kind (a later kind must beat solid wire clearly).
     */
    screened: number;
    /** Feasible candidates: the best build of each core × material × conductor kind × placement that meets every limit. */
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

/** Keep-outs beyond the limit's the search tries when the gap-field loss is worth it (m). */
export const EXTRA_KEEP_OUTS = [0.5e-3, 1e-3, 2e-3] as const;
/** More keep-out is tried only when the gap-field loss is at least this fraction of the total loss. */
const KEEP_OUT_TRY_FRACTION = 0.02;

/**
 * The winding at the limit's keep-out, or at a larger one (EXTRA_KEEP_OUTS) when the gap-field loss is worth it and
 * that lowers the total loss without a failure the limit's keep-out did not have: window traded for distance from
 * the gap. Keep-outs are tried from the smallest up to the first that adds a failure and the lowest loss is kept. On
 * one layout the loss rises with the gap-field scale alone (a stable temperature iteration passes a lower loss on as
 * a lower temperature), so keep-outs are compared by their scale, a field sum without a temperature: the build check
 * needs none either (a keep-out the bobbin cannot take ends the tries), and only a keep-out whose scale is above the
 * limit's, whose loss is higher and may fail a temperature limit, is solved to see whether it ends them. A ground
 * gap's field only falls with distance, so the largest keep-out is the lowest; a spacer's outer-leg gap lies across
 * the window and more keep-out brings the winding nearer to it. Works on the layout layOutWinding left in `out` and
 * leaves the chosen keep-out's figures there.
 */
function evaluateWithKeepOut(
  ctx: SpecContext,
  coreCtx: CoreContext,
  matCtx: MaterialContext,
  mag: MagneticDesign,
  wireCtx: WireContext,
  out: CandidateFigures,
): void {
  const base = ctx.limits.keepOut;
  evaluateWindingLosses(ctx, coreCtx, matCtx, mag, wireCtx, out, base);
  if (!(out.gapLoss > KEEP_OUT_TRY_FRACTION * out.totalLoss)) return;
  copyWindingLosses(out, atBaseKeepOut);
  const core = coreCtx.core;
  const baseFailures = out.windingFailures;
  const baseLoss = out.totalLoss;
  const baseScale = out.loss.gapLossScale;
  const buildChecked = (baseFailures & FAILURE.build) === 0;
  let tries = 0;
  while (tries < EXTRA_KEEP_OUTS.length && (!buildChecked || buildFitsWithKeepOut(core, out, base + EXTRA_KEEP_OUTS[tries]!))) {
    tries++;
  }
  let best = base;
  let bestScale = baseScale;
  // A ground gap: the largest keep-out has the lowest scale, the others need no field sum.
  for (let i = mag.placement === 'spacer' ? 0 : tries - 1; i < tries; i++) {
    const keepOut = base + EXTRA_KEEP_OUTS[i]!;
    const scale = gapLossScale(core, matCtx.material, mag, out, wireCtx.wire, keepOut);
    if (scale > baseScale) {
      evaluateWindingLosses(ctx, coreCtx, matCtx, mag, wireCtx, out, keepOut, scale);
      if ((out.windingFailures & ~baseFailures) !== 0) break;
    } else if (scale < bestScale) {
      best = keepOut;
      bestScale = scale;
    }
  }
  if (best !== base) {
    evaluateWindingLosses(ctx, coreCtx, matCtx, mag, wireCtx, out, best, bestScale);
    if ((out.windingFailures & ~baseFailures) === 0 && out.totalLoss < baseLoss) return;
  }
  if (out.keepOut !== base) copyWindingLosses(atBaseKeepOut, out);
}

/** The limit's keep-out figures while evaluateWithKeepOut tries others on the same layout. */
const atBaseKeepOut = new CandidateFigures();

/**
 * A candidate whose loss cannot be below `floor` changes no group when its kind and placement already have a build
 * that loses no more, or when it is not solid wire and loses clearly more than the best solid build of its placement
 * (dropNeedlessConductors drops every later kind that does not beat solid wire by SIMPLER_CONDUCTOR_PREFERENCE).
 */
function cannotChangeGroups(groups: readonly Group[], pairGroups: Int32Array, placement: number, type: number, floor: number): boolean {
  const row = placement * CONDUCTOR_TYPES.length;
  const own = pairGroups[row + type]!;
  if (own >= 0 && floor >= groups[own]!.loss) return true;
  const solid = pairGroups[row + SOLID]!;
  return type !== SOLID && solid >= 0 && floor > groups[solid]!.loss * (1 - SIMPLER_CONDUCTOR_PREFERENCE);
}

const nextTurns = (turns: number) => (turns < TURNS_GEOMETRIC_FROM ? turns + 1 : Math.ceil(turns * TURNS_GEOMETRIC_STEP));

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
  // Placement indices tried on air-gap cores; distributed-gap cores have no gap to place.
  const airGapPlacements = GAP_PLACEMENTS.flatMap((p, i) => (!limits.gapPlacements || limits.gapPlacements.includes(p) ? [i] : []));
  const noPlacement = [GAP_PLACEMENTS.indexOf('ground')];
  const mags: MagneticDesign[] = [];

  const groups: Group[] = [];
  const pairs: PairState[] = [];
  const prefilteredCores: InfeasibleCandidate[] = [];
  let evaluated = 0;
  let screened = 0;
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
        bestFailedPlacement: 0,
        bestFailures: 0,
        bestFailedLoss: Number.POSITIVE_INFINITY,
        feasible: false,
      };
      pairs.push(pair);
      const placements = core.gapKind === 'distributed' ? noPlacement : airGapPlacements;
      const pairGroups = new Int32Array(CONDUCTOR_TYPES.length * GAP_PLACEMENTS.length).fill(-1);
      // The auto turns do not depend on the placement: the sweep starts at the same turns for each.
      const first = designMagnetics(core, material, ctx, 'auto', 'auto', GAP_PLACEMENTS[placements[0]!], false);
      let lowest = Number.POSITIVE_INFINITY;
      let withoutGain = 0;
      for (let turns = first.turns; ; turns = nextTurns(turns)) {
        // Only applyMagnetics reads these: a ground design's same-L spacer is left for the built candidate.
        for (let p = 0; p < placements.length; p++) {
          mags[p] =
            turns === first.turns && p === 0
              ? first
              : designMagnetics(core, material, ctx, turns, 'auto', GAP_PLACEMENTS[placements[p]!], false);
        }
        const choice = chooser.best(core, c, turns);
        let stepLowest = Number.POSITIVE_INFINITY;
        let anyWire = false;
        for (let t = 0; t < CONDUCTOR_TYPES.length; t++) {
          const w = choice[t]!;
          if (w < 0) continue;
          anyWire = true;
          layOutWinding(ctx, coreCtxs[c]!, materialCtxs[m]!, turns, mags[0]!.fluxAtLoad, wireCtxs[w]!, figures);
          // Below this no placement or keep-out of the layout can lose (lossFloor); 0 while every build must be solved.
          const floor = pair.feasible && !input.solveEveryBuild ? lossFloor(ctx, materialCtxs[m]!, figures) : 0;
          for (let p = 0; p < placements.length; p++) {
            const placement = placements[p]!;
            if (floor >= lowest && cannotChangeGroups(groups, pairGroups, placement, t, floor)) {
              screened++;
              continue;
            }
            evaluated++;
            // The layout is the placements'; the gap-field loss, hence the losses and temperature, are each one's own.
            evaluateWithKeepOut(ctx, coreCtxs[c]!, materialCtxs[m]!, mags[p]!, wireCtxs[w]!, figures);
            if (figures.totalLoss < stepLowest) stepLowest = figures.totalLoss;
            if (applyMagnetics(ctx, core, material, mags[p]!, figures)) {
              pair.feasible = true;
              recordFeasible(groups, pairGroups, { c, m, t, turns, w, placement }, figures, core, material, wireCtxs[w]!);
            } else if (!pair.feasible) {
              const count = popcount(figures.failures);
              if (
                pair.bestFailedWire < 0 ||
                count < pair.bestFailures ||
                (count === pair.bestFailures && figures.totalLoss < pair.bestFailedLoss)
              ) {
                pair.bestFailedWire = w;
                pair.bestFailedTurns = turns;
                pair.bestFailedPlacement = placement;
                pair.bestFailures = count;
                pair.bestFailedLoss = figures.totalLoss;
              }
            }
          }
        }
        // Distributed-gap cores: the turns follow from the inductance. Gapped: more turns until the loss rises for good.
        if (first.kind === 'distributed' || !anyWire || turns >= turnLimit) break;
        if (stepLowest < lowest * (1 - 1e-9)) {
          lowest = stepLowest;
          withoutGain = 0;
        } else if (++withoutGain >= TURNS_STEPS_WITHOUT_GAIN) break;
      }
      for (const p of placements) {
        dropNeedlessConductors(groups, pairGroups.subarray(p * CONDUCTOR_TYPES.length, (p + 1) * CONDUCTOR_TYPES.length));
      }
    }
  }

  const kept = groups.filter((g) => g.turns > 0);
  const ranked: RankedFigures[] = kept.map((g) => ({
    loss: g.loss,
    volume: cores[g.core]!.ve,
    mass: g.mass,
    rise: g.rise,
    extrapolated: g.extrapolated,
    lossNotModelled: g.lossNotModelled,
    // Conductor kind first, then ground before spacer (the same part otherwise: equal loss, volume and mass).
    simplicity: g.conductor * GAP_PLACEMENTS.length + g.placement,
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
    const placement = GAP_PLACEMENTS[g.placement]!;
    const mag = designMagnetics(core, material, ctx, g.turns, 'auto', placement);
    const wireCtx = wireCtxs[g.wire]!;
    evaluateCandidate(ctx, coreCtxs[g.core]!, materialCtxs[g.material]!, mag, wireCtx, figures, g.keepOut);
    return {
      rank: rankOf[i]!,
      pareto: onVolumeFront.has(i),
      paretoByMass: onMassFront.has(i),
      extrapolated: g.extrapolated,
      lossNotModelled: g.lossNotModelled,
      conductor: CONDUCTOR_TYPES[g.conductor]!,
      placement,
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
      screened,
      feasible: kept.length,
      extrapolated: kept.filter((g) => g.extrapolated).length,
      prefiltered,
      incompatible,
    },
    requiredAreaProduct: required,
  };
}
