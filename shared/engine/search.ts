import { availableAreaProduct, requiredAreaProduct } from './area-product';
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
  prepareWire,
  type CoreContext,
  type MagneticDesign,
  type MaterialContext,
  type WireContext,
} from './kernel';
import type { CoreMaterial, CoreShape, WireOption } from './types';
import { chooseWire } from './wire-choice';

/** Cores whose area product is below this fraction of the requirement are reported, not evaluated. */
export const AREA_PRODUCT_PREFILTER = 0.5;

export interface SearchInput {
  spec: ConverterSpec;
  limits?: Partial<DesignLimits>;
  cores: readonly CoreShape[];
  materials: readonly CoreMaterial[];
  wires: readonly WireOption[];
  rankBy?: RankBy;
  /** Feasible candidates to return (default 20). */
  limit?: number;
  /** Infeasible core × material pairs to explain, closest to feasible first (default 30); every prefiltered core follows. */
  infeasibleLimit?: number;
}

export interface SearchCandidate {
  rank: number;
  /** On the loss-versus-volume Pareto front of all feasible candidates. */
  pareto: boolean;
  /** The wire option as evaluated (it may be an n-in-hand variant the catalogue lists only singly). */
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
  candidates: SearchCandidate[];
  /** The whole Pareto front (loss versus core volume), smallest core first. */
  paretoFront: SearchCandidate[];
  infeasible: InfeasibleCandidate[];
  counts: {
    cores: number;
    materials: number;
    wireOptions: number;
    evaluated: number;
    feasible: number;
    prefiltered: number;
    incompatible: number;
  };
  requiredAreaProduct: number;
  wireOptionIds: string[];
}

/** Air-gap cores take gapped (non-powder) materials; distributed-gap cores take powder materials. */
export function compatible(core: CoreShape, material: CoreMaterial): boolean {
  const isPowder = material.family === 'powder';
  return core.gapKind === 'distributed' ? isPowder : !isPowder;
}

const cm4 = (m4: number) => (m4 * 1e8).toFixed(2);

function popcount(bits: number): number {
  let count = 0;
  for (let b = bits; b !== 0; b &= b - 1) count++;
  return count;
}

export function searchCandidates(input: SearchInput): SearchResult {
  const rankBy = input.rankBy ?? 'loss';
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
  const wireChoice = chooseWire(op.rmsCurrent, limits.currentDensity, ctx.skinDepth, input.wires, limits.maxStrands);
  const wireCtxs: WireContext[] = wireChoice.options.map((w) => prepareWire(w, ctx));
  const materialCtxs: MaterialContext[] = materials.map((m) => prepareMaterial(m, ctx));

  const capacity = Math.max(1, cores.length * materials.length * wireCtxs.length);
  const score = new Float64Array(capacity);
  const loss = new Float64Array(capacity);
  const volume = new Float64Array(capacity);
  const pairOf = new Int32Array(capacity);
  const wireOf = new Int32Array(capacity);
  const pairCore: number[] = [];
  const pairMaterial: number[] = [];
  const pairDesign: MagneticDesign[] = [];
  const coreCtxs: CoreContext[] = [];
  const prefilteredCores: InfeasibleCandidate[] = [];
  const infeasible: InfeasibleCandidate[] = [];
  const infeasiblePairs: { pair: number; wire: number; failures: number; loss: number }[] = [];
  const figures = new CandidateFigures();

  let evaluated = 0;
  let feasibleCount = 0;
  let prefiltered = 0;
  let incompatible = 0;

  for (let c = 0; c < cores.length; c++) {
    const core = cores[c]!;
    const coreCtx = prepareCore(core);
    coreCtxs.push(coreCtx);
    const available = availableAreaProduct(core);
    if (available < AREA_PRODUCT_PREFILTER * required) {
      prefiltered++;
      prefilteredCores.push({
        coreId: core.id,
        reasons: [
          {
            code: 'area-product',
            severity: 'error',
            message: `Area product ${cm4(available)} cm⁴ < required ${cm4(required)} cm⁴.`,
          },
        ],
      });
      continue;
    }
    for (let m = 0; m < materials.length; m++) {
      const material = materials[m]!;
      if (!compatible(core, material)) {
        incompatible++;
        continue;
      }
      const mag = designMagnetics(core, material, ctx);
      const pair = pairDesign.length;
      pairCore.push(c);
      pairMaterial.push(m);
      pairDesign.push(mag);
      let bestFailedWire = -1;
      let bestFailures = 0;
      let bestFailedLoss = Number.POSITIVE_INFINITY;
      let pairFeasible = false;
      for (let w = 0; w < wireCtxs.length; w++) {
        evaluated++;
        if (evaluateCandidate(ctx, coreCtx, materialCtxs[m]!, mag, wireCtxs[w]!, figures)) {
          const i = feasibleCount++;
          loss[i] = figures.totalLoss;
          volume[i] = core.ve;
          score[i] = rankBy === 'loss' ? figures.totalLoss : rankBy === 'volume' ? core.ve : figures.rise;
          pairOf[i] = pair;
          wireOf[i] = w;
          pairFeasible = true;
        } else if (!pairFeasible) {
          const count = popcount(figures.failures);
          const better = bestFailedWire < 0 || count < bestFailures || (count === bestFailures && figures.totalLoss < bestFailedLoss);
          if (better) {
            bestFailedWire = w;
            bestFailures = count;
            bestFailedLoss = figures.totalLoss;
          }
        }
      }
      if (!pairFeasible && bestFailedWire >= 0) {
        infeasiblePairs.push({ pair, wire: bestFailedWire, failures: bestFailures, loss: bestFailedLoss });
      }
    }
  }

  // Rank feasible candidates (ties: lower loss, then smaller core).
  const order = Array.from({ length: feasibleCount }, (_, i) => i);
  order.sort((a, b) => score[a]! - score[b]! || loss[a]! - loss[b]! || volume[a]! - volume[b]!);

  // Pareto front on (volume, loss): sweep by volume ascending, keep strictly falling loss.
  const pareto = new Uint8Array(feasibleCount);
  const byVolume = Array.from({ length: feasibleCount }, (_, i) => i).sort((a, b) => volume[a]! - volume[b]! || loss[a]! - loss[b]!);
  let bestLoss = Number.POSITIVE_INFINITY;
  const front: number[] = [];
  for (const i of byVolume) {
    if (loss[i]! < bestLoss) {
      pareto[i] = 1;
      bestLoss = loss[i]!;
      front.push(i);
    }
  }

  const rankOf = new Int32Array(feasibleCount);
  order.forEach((i, position) => (rankOf[i] = position + 1));
  const build = (i: number): SearchCandidate => {
    const pair = pairOf[i]!;
    const m = pairMaterial[pair]!;
    const c = pairCore[pair]!;
    evaluateCandidate(ctx, coreCtxs[c]!, materialCtxs[m]!, pairDesign[pair]!, wireCtxs[wireOf[i]!]!, figures);
    return {
      rank: rankOf[i]!,
      pareto: pareto[i] === 1,
      wire: wireCtxs[wireOf[i]!]!.wire,
      result: assembleResult(ctx, cores[c]!, materials[m]!, pairDesign[pair]!, wireCtxs[wireOf[i]!]!, figures),
    };
  };
  const limit = input.limit ?? 20;
  const candidates = order.slice(0, limit).map(build);
  const paretoFront = front.map(build);

  infeasiblePairs.sort((a, b) => a.failures - b.failures || a.loss - b.loss);
  const infeasibleLimit = input.infeasibleLimit ?? 30;
  for (const entry of infeasiblePairs.slice(0, infeasibleLimit)) {
    const c = pairCore[entry.pair]!;
    const m = pairMaterial[entry.pair]!;
    const mag = pairDesign[entry.pair]!;
    evaluateCandidate(ctx, coreCtxs[c]!, materialCtxs[m]!, mag, wireCtxs[entry.wire]!, figures);
    infeasible.push({
      coreId: cores[c]!.id,
      materialId: materials[m]!.id,
      wireId: wireCtxs[entry.wire]!.wire.id,
      turns: mag.turns,
      totalLoss: figures.totalLoss,
      reasons: describeIssues({ ctx, core: cores[c]!, material: materials[m]!, mag, figures }).filter((x) => x.severity === 'error'),
    });
  }

  return {
    rankBy,
    candidates,
    paretoFront,
    infeasible: [...infeasible, ...prefilteredCores],
    counts: {
      cores: cores.length,
      materials: materials.length,
      wireOptions: wireCtxs.length,
      evaluated,
      feasible: feasibleCount,
      prefiltered,
      incompatible,
    },
    requiredAreaProduct: required,
    wireOptionIds: wireCtxs.map((w) => w.wire.id),
  };
}
