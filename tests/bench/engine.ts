// Engine benchmark: candidate evaluations per second on one core, and search latency over the core catalogue
// (1×, 4× and 16× with perturbed copies) × 20 invented materials × the proposed wire options.
// Run directly: node --import tsx tests/bench/engine.ts (or npm run bench for the whole report)
import { pathToFileURL } from 'node:url';
import { performance } from 'node:perf_hooks';
import {
  CandidateFigures,
  compatible,
  designMagnetics,
  evaluateCandidate,
  chooseWire,
  prepareCore,
  prepareMaterial,
  prepareSpec,
  prepareWire,
  searchCandidates,
  type ConverterSpec,
  type CoreMaterial,
  type CoreShape,
  type WireOption,
} from '@shared/engine/index';
import { standardFoilOptions } from '@shared/catalogue/foil';
import { percentile } from './stats.ts';

export interface BenchRow {
  name: string;
  value: string;
}

export const BENCH_SPEC: ConverterSpec = {
  vinMin: 24,
  vinMax: 36,
  vout: 12,
  ioutMax: 10,
  frequency: 100e3,
  rippleRatio: 0.3,
  rectifier: 'ideal',
};
const SEARCH_RUNS = 50;

/** 20 invented materials (16 ferrite-like, 4 powder-like) with coefficients in the generic ranges of the trade. */
export function inventedMaterials(): CoreMaterial[] {
  const materials: CoreMaterial[] = [];
  for (let i = 0; i < 16; i++) {
    materials.push({
      id: `bench-ferrite-${i}`,
      name: `bench ferrite ${i} (invented)`,
      family: 'ferrite',
      k: 1 + i * 0.7,
      alpha: 1.1 + (i % 8) * 0.1,
      beta: 2.4 + (i % 5) * 0.1,
      fitFrequencyMin: 20e3,
      fitFrequencyMax: 500e3,
      fitFluxMin: 0.01,
      fitFluxMax: 0.3,
      tempCoefficients: { ct2: 1e-4, ct1: 2e-4 * 90, ct0: 1 + 1e-4 * 8100 },
      bsat25: 0.48 + (i % 3) * 0.02,
      bsat100: 0.37 + (i % 3) * 0.02,
      permeability: 1500 + i * 150,
      density: 4800,
    });
  }
  for (let i = 0; i < 4; i++) {
    const c = 1.2 + i * 0.1;
    materials.push({
      id: `bench-powder-${i}`,
      name: `bench powder ${i} (invented)`,
      family: 'powder',
      k: 40 + i * 20,
      alpha: 1.2 + i * 0.05,
      beta: 2.1 + i * 0.1,
      fitFrequencyMin: 10e3,
      fitFrequencyMax: 500e3,
      fitFluxMin: 0.005,
      fitFluxMax: 0.5,
      bsat25: 1.0,
      bsat100: 0.95,
      permeability: [26, 40, 60, 90][i]!,
      rollOff: { a: 1, b: Math.pow(6000 + i * 2000, -c), c },
      density: 7000,
    });
  }
  return materials;
}

/** Invented core set used when the catalogue is not available: ETD/E-like pairs and powder rings, scaled. */
function syntheticCores(): CoreShape[] {
  const cores: CoreShape[] = [];
  for (let i = 0; i < 56; i++) {
    const s = 0.6 + i * 0.03;
    cores.push({
      id: `synthetic-E-${i}`,
      family: i % 2 ? 'E' : 'ETD',
      gapKind: 'air-gap',
      ae: 97e-6 * s * s,
      le: 78.6e-3 * s,
      ve: 97e-6 * 78.6e-3 * s ** 3,
      windowArea: 175e-6 * s * s,
      windowHeight: 23.6e-3 * s,
      bobbinWidth: 21e-3 * s,
      bobbinHeight: 6e-3 * s,
      mlt: 60e-3 * s,
      surfaceArea: 60e-4 * s * s,
      source: 'synthetic (invented) bench core',
    });
  }
  for (let i = 0; i < 14; i++) {
    const s = 0.7 + i * 0.08;
    const od = 26.9e-3 * s;
    const id = 14.7e-3 * s;
    const h = 11.2e-3 * s;
    cores.push({
      id: `synthetic-ring-${i}`,
      family: 'POWDER_TOROID',
      gapKind: 'distributed',
      ae: 66.28e-6 * s * s,
      le: 61.53e-3 * s,
      ve: 4078e-9 * s ** 3,
      windowArea: (Math.PI * id * id) / 4,
      windowHeight: h,
      bobbinWidth: Math.PI * id,
      bobbinHeight: id / 2,
      mlt: od - id + 2 * h,
      surfaceArea: 30e-4 * s * s,
      ring: { od, id, height: h },
      source: 'synthetic (invented) bench core',
    });
  }
  return cores;
}

function syntheticWires(): WireOption[] {
  const wires: WireOption[] = [];
  for (const d of [0.2, 0.25, 0.315, 0.4, 0.45, 0.5, 0.56, 0.63, 0.71, 0.8, 0.9, 1.0, 1.12, 1.25, 1.4, 1.6]) {
    for (let n = 1; n <= 8; n++) {
      wires.push({
        id: `${d} mm ×${n}`,
        kind: 'metric',
        strandDiameter: d * 1e-3,
        strands: n,
        overallDiameter: d * 1.07e-3,
        conductorsPerTurn: n,
        grade: 1,
      });
    }
  }
  for (const [n, d] of [
    [420, 0.1],
    [660, 0.1],
    [1050, 0.071],
  ] as const) {
    wires.push({
      id: `litz ${n}×${d}`,
      kind: 'litz',
      strandDiameter: d * 1e-3,
      strands: n,
      overallDiameter: 1.3 * Math.sqrt(n) * d * 1e-3,
      conductorsPerTurn: 1,
    });
  }
  return wires;
}

export async function loadCatalogue(): Promise<{ cores: CoreShape[]; wires: WireOption[]; source: string }> {
  let cores: CoreShape[] | undefined;
  let wires: WireOption[] | undefined;
  try {
    const catalogue = (await import('@core-data/catalogue')) as { loadCoreCatalogue?: () => CoreShape[] };
    cores = catalogue.loadCoreCatalogue?.();
  } catch {
    cores = undefined;
  }
  try {
    const wireCatalogue = (await import('@core-data/wire-catalogue')) as { loadStandardWireOptions?: () => WireOption[] };
    wires = wireCatalogue.loadStandardWireOptions?.();
    if (wires?.length) wires = [...wires, ...standardFoilOptions()];
  } catch {
    wires = undefined;
  }
  const source = `${cores?.length ? 'catalogue' : 'synthetic'} cores, ${wires?.length ? 'catalogue' : 'synthetic'} wires`;
  return { cores: cores?.length ? cores : syntheticCores(), wires: wires?.length ? wires : syntheticWires(), source };
}

/** Copies of every core scaled by a few per cent, so a bigger catalogue has distinct sizes. */
function replicate(cores: readonly CoreShape[], times: number): CoreShape[] {
  const out: CoreShape[] = [];
  for (let r = 0; r < times; r++) {
    const s = 1 + (r - (times - 1) / 2) * 0.015;
    for (const core of cores) {
      out.push(
        r === 0
          ? core
          : {
              ...core,
              id: `${core.id}~${r}`,
              ae: core.ae * s * s,
              le: core.le * s,
              ve: core.ve * s ** 3,
              windowArea: core.windowArea * s * s,
              windowHeight: core.windowHeight * s,
              bobbinWidth: core.bobbinWidth * s,
              bobbinHeight: core.bobbinHeight * s,
              mlt: core.mlt * s,
              surfaceArea: core.surfaceArea * s * s,
              ring: core.ring && { od: core.ring.od * s, id: core.ring.id * s, height: core.ring.height * s },
            },
      );
    }
  }
  return out;
}

/** Kernel throughput: every core × material × proposed wire, repeated for about a second. */
function evaluationsPerSecond(cores: readonly CoreShape[], materials: readonly CoreMaterial[], wires: readonly WireOption[]) {
  const ctx = prepareSpec(BENCH_SPEC);
  const choice = chooseWire(ctx.op.rmsCurrent, ctx.limits.currentDensity, ctx.skinDepth, wires, ctx.limits.maxStrands);
  const wireCtxs = choice.options.map((w) => prepareWire(w, ctx));
  const materialCtxs = materials.map((m) => prepareMaterial(m, ctx));
  const jobs = [];
  for (const core of cores) {
    const coreCtx = prepareCore(core);
    for (const matCtx of materialCtxs) {
      if (!compatible(core, matCtx.material)) continue;
      jobs.push({ coreCtx, matCtx, mag: designMagnetics(core, matCtx.material, ctx) });
    }
  }
  const figures = new CandidateFigures();
  let count = 0;
  let feasible = 0;
  const start = performance.now();
  let elapsed = 0;
  while (elapsed < 1000) {
    for (const job of jobs) {
      for (const wireCtx of wireCtxs) {
        if (evaluateCandidate(ctx, job.coreCtx, job.matCtx, job.mag, wireCtx, figures)) feasible++;
        count++;
      }
    }
    elapsed = performance.now() - start;
  }
  return { perSecond: count / (elapsed / 1000), feasibleShare: feasible / count };
}

function searchLatency(cores: CoreShape[], materials: CoreMaterial[], wires: WireOption[]) {
  const times: number[] = [];
  let evaluated = 0;
  let feasible = 0;
  for (let i = 0; i < 5; i++) searchCandidates({ spec: BENCH_SPEC, cores, materials, wires });
  for (let i = 0; i < SEARCH_RUNS; i++) {
    const start = performance.now();
    const result = searchCandidates({ spec: BENCH_SPEC, cores, materials, wires });
    times.push(performance.now() - start);
    evaluated = result.counts.evaluated;
    feasible = result.counts.feasible;
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), evaluated, feasible };
}

export async function runEngineBench(): Promise<BenchRow[]> {
  const { cores, wires, source } = await loadCatalogue();
  const materials = inventedMaterials();
  const rows: BenchRow[] = [
    { name: 'engine bench data', value: `${source}; ${cores.length} cores × ${materials.length} invented materials` },
  ];
  const kernel = evaluationsPerSecond(cores, materials, wires);
  rows.push({
    name: 'engine evaluations per second (one core)',
    value: `${Math.round(kernel.perSecond).toLocaleString('en')} (${(kernel.feasibleShare * 100).toFixed(0)} % feasible)`,
  });
  for (const times of [1, 4, 16]) {
    const set = replicate(cores, times);
    const s = searchLatency(set, materials, wires);
    rows.push({
      name: `engine search ${times}× catalogue (${set.length} cores) p50 / p95`,
      value: `${s.p50.toFixed(1)} ms / ${s.p95.toFixed(1)} ms (${s.evaluated} evaluated, ${s.feasible} feasible)`,
    });
  }
  return rows;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const rows = await runEngineBench();
  const width = Math.max(...rows.map((r) => r.name.length));
  for (const row of rows) console.log(`${row.name.padEnd(width)}  ${row.value}`);
}
