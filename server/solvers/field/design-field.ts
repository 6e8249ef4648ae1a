// Meshes and solves a design's 2-D field model (axisymmetric, or planar for E and EFD): once magnetostatic at 1 A
// (inductance from the stored energy, |B| in the core), then harmonic at each frequency asked for with every conductor
// massive (AC resistance from the Joule loss, by conductor and by layer). Linear materials, so figures at 1 A scale
// with the current. The solver's integrals are per radian (axisymmetric: ×2π) or per metre of depth (planar: ×depth).
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { MU0 } from '@shared/engine/constants';
import { withSolverFolder, type SolverFolder } from '../solver-run.ts';
import { axiProblem, type ProblemConductor } from './axi-problem.ts';
import { designModel, REGION, type DesignModel, type FieldDesignInput, type ModelConductor } from './design-model.ts';
import { buildGeo, type Outline, type Surface } from './geo-builder.ts';
import { maxOfSimpleTable, readGlobalTable, readMsh2, readNodeTable, type TriangleMesh } from './mesh-reader.ts';

export interface HarmonicFigures {
  frequency: number;
  /** Total Joule loss over I_rms² (Ω). */
  resistance: number;
  /** Each layer's share of that resistance (Ω), innermost layer first. */
  layers: number[];
  /** Inductance from the time-averaged magnetic energy at this frequency (H). */
  inductance: number;
}

export interface FieldDesignResult {
  /** From the stored energy at 1 A: L = 2·W (H). */
  inductance: number;
  /** Largest |B| over the core's elements, and the mean |B| over the centre leg, at 1 A (T/A). */
  peakFluxPerAmp: number;
  legFluxPerAmp: number;
  /** DC resistance of the modelled conductors (rings of the bare section; planar: straight runs of the depth), exact for that geometry (Ω). */
  dcResistance: number;
  harmonics: HarmonicFigures[];
  nodes: number;
  seconds: { mesh: number; static: number; harmonic: number };
  /** Which model, and for the planar one the depth its per-metre figures were multiplied by (m). */
  model: { kind: 'axisymmetric' } | { kind: 'planar'; depth: number };
  /**
   * Mesh, the flux function at the nodes (static, 1 A: r·Aφ axisymmetric, Az planar), the outlines and the region
   * worth showing, for the field picture.
   */
  picture: {
    mesh: TriangleMesh;
    fluxFunction: Map<number, number>;
    core: Outline[];
    conductors: Outline[];
    view: AxiModel['view'];
    planar: boolean;
  };
}

export interface SolveOptions {
  /** Copper resistivity (Ω·m) at the temperature compared. */
  resistivity: number;
  /** Harmonic solves (Hz); the first sets the conductor mesh. */
  frequencies: number[];
}

const TIMEOUT_MS = 120_000;
const SOLVER_ERROR = /^\s*(Error|Fatal)\b/;

export const skinDepthOf = (resistivity: number, frequency: number) => Math.sqrt(resistivity / (Math.PI * frequency * MU0));

/** Area of an outline (m²): the circle's, or the polygon's by the shoelace formula. */
export function outlineArea(outline: Outline): number {
  if (outline.kind === 'circle') return Math.PI * outline.radius ** 2;
  const c = outline.corners;
  return Math.abs(c.reduce((sum, [x, y], i) => sum + x * c[(i + 1) % c.length]![1] - c[(i + 1) % c.length]![0] * y, 0)) / 2;
}

/** DC resistance of a conductor as a ring about the axis: 2πρ/∫(1/r)dA. */
export function ringResistance(outline: Outline, resistivity: number): number {
  if (outline.kind === 'circle') {
    const [r0] = outline.centre;
    const a = outline.radius;
    return resistivity / (r0 - Math.sqrt(r0 * r0 - a * a));
  }
  const rs = outline.corners.map((c) => c[0]);
  const zs = outline.corners.map((c) => c[1]);
  const height = Math.max(...zs) - Math.min(...zs);
  return (2 * Math.PI * resistivity) / (height * Math.log(Math.max(...rs) / Math.min(...rs)));
}

export async function solveFieldDesign(design: FieldDesignInput, options: SolveOptions): Promise<FieldDesignResult> {
  // No harmonic asked for: the conductors are meshed for their shape only (no skin depth to resolve).
  const top = Math.max(0, ...options.frequencies);
  const model = designModel(design, skinDepthOf(options.resistivity, top));
  return solveAxiModel(
    {
      surfaces: model.surfaces,
      sizeAt: model.sizeAt,
      conductors: model.conductors,
      permeability: design.permeability,
      hasCore: true,
      view: model.view,
      ...(model.planar ? { planar: model.planar } : {}),
    },
    options,
  );
}

export interface AxiModel {
  surfaces: Surface[];
  sizeAt(r: number, z: number): number;
  conductors: (ModelConductor & ProblemConductor)[];
  permeability: number;
  hasCore: boolean;
  view: DesignModel['view'];
  /** A planar model (x–y) and its depth (m); absent: axisymmetric (r–z). */
  planar?: { depth: number };
}

/** Solves any 2-D model of core, air and conductors (the design's, or a closed-form case's). */
export async function solveAxiModel(model: AxiModel, options: SolveOptions): Promise<FieldDesignResult> {
  const box = Math.max(
    ...model.surfaces.flatMap((s) => (s.outline.kind === 'polygon' ? s.outline.corners.map((c) => Math.abs(c[1])) : [])),
  );
  // Per radian → whole turn (2π), or per metre → the model's depth.
  const extent = model.planar ? model.planar.depth : 2 * Math.PI;
  const geometry = buildGeo({
    surfaces: model.surfaces,
    sizeAt: model.sizeAt,
    curveGroups: [
      ...(model.planar ? [] : [{ group: REGION.axis, holds: (r: number) => Math.abs(r) < 1e-12 }]),
      { group: REGION.boundary, holds: (r, z) => Math.abs(r) >= box * (1 - 1e-9) || Math.abs(z) >= box * (1 - 1e-9) },
    ],
  });
  const problem = axiProblem({
    permeability: model.permeability,
    conductors: model.conductors,
    conductivity: 1 / options.resistivity,
    hasCore: model.hasCore,
    planar: model.planar !== undefined,
  });
  return withSolverFolder({ 'model.geo': geometry, 'model.pro': problem }, async (folder) => {
    let clock = performance.now();
    const lap = () => {
      const now = performance.now();
      const seconds = (now - clock) / 1000;
      clock = now;
      return seconds;
    };
    const meshLog = await folder.run({
      program: 'gmsh',
      args: ['-2', '{folder}/model.geo', '-o', '{folder}/model.msh'],
      timeoutMs: TIMEOUT_MS,
      errorLine: SOLVER_ERROR,
    });
    const meshSeconds = lap();
    await getdp(folder, ['-solve', 'Magnetostatic', '-pos', 'Static', '-name', '{folder}/static']);
    const [perRadian] = readGlobalTable(await folder.read('energy.txt'), 1);
    const staticFigures = model.hasCore
      ? {
          peak: maxOfSimpleTable(await folder.read('core-b.txt')),
          leg: readGlobalTable(await folder.read('leg-b.txt'), 1)[0]! / readGlobalTable(await folder.read('leg-volume.txt'), 1)[0]!,
        }
      : { peak: 0, leg: 0 };
    const staticSeconds = lap();
    const harmonics: HarmonicFigures[] = [];
    for (const frequency of options.frequencies) {
      await rm(path.join(folder.path, 'joule.txt'), { force: true });
      await getdp(folder, [
        '-setnumber',
        'freq',
        String(frequency),
        '-solve',
        'Harmonic',
        '-pos',
        'Dynamic',
        '-name',
        `{folder}/h${harmonics.length}`,
      ]);
      // Peak phasors at 1 A: P = ½·R·I², so each conductor's resistance share is 2·P.
      const losses = readGlobalTable(await folder.read('joule.txt'), model.conductors.length).map((p) => 2 * extent * p);
      const layers: number[] = [];
      model.conductors.forEach((k, i) => (layers[k.layer] = (layers[k.layer] ?? 0) + losses[i]!));
      const [acEnergy] = readGlobalTable(await folder.read('ac-energy.txt'), 1);
      harmonics.push({ frequency, resistance: layers.reduce((a, b) => a + b, 0), layers, inductance: 4 * extent * acEnergy! });
    }
    const harmonicSeconds = lap();
    const mesh = readMsh2(await folder.read('model.msh'));
    const az = readNodeTable(await folder.read('az.txt'));
    const fluxFunction = model.planar ? az : new Map([...az].map(([id, a]) => [id, mesh.nodes.get(id)![0] * a]));
    const depth = model.planar?.depth;
    const conductorResistance = (outline: Outline) =>
      depth === undefined ? ringResistance(outline, options.resistivity) : (options.resistivity * depth) / outlineArea(outline);
    return {
      inductance: 2 * extent * perRadian!,
      peakFluxPerAmp: staticFigures.peak,
      legFluxPerAmp: staticFigures.leg,
      dcResistance: model.conductors.reduce((sum, k) => sum + k.share * k.share * conductorResistance(k.outline), 0),
      harmonics,
      nodes: Number(/(\d+) nodes/.exec(meshLog)?.[1] ?? mesh.nodes.size),
      seconds: { mesh: meshSeconds, static: staticSeconds, harmonic: harmonicSeconds },
      picture: {
        mesh,
        fluxFunction,
        core: model.surfaces.filter((s) => s.group === REGION.leg || s.group === REGION.coreRest).map((s) => s.outline),
        conductors: model.conductors.map((k) => k.outline),
        view: model.view,
        planar: depth !== undefined,
      },
      model: depth === undefined ? { kind: 'axisymmetric' } : { kind: 'planar', depth },
    };
  });
}

function getdp(folder: SolverFolder, args: string[]): Promise<string> {
  return folder.run({
    program: 'getdp',
    args: ['{folder}/model.pro', '-msh', '{folder}/model.msh', ...args],
    timeoutMs: TIMEOUT_MS,
    errorLine: SOLVER_ERROR,
  });
}
