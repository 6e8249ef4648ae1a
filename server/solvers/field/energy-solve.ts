// One magnetostatic field solution of a model whose problem ends with MAGNETOSTATIC_ENERGY: gmsh meshes `core.geo`,
// GetDP solves `core.pro` and prints the stored energy; both in a folder of their own, with time limits and logs read.
import { withSolverFolder } from '../solver-run.ts';

const TIMEOUT_MS = 120_000;
const SOLVER_ERROR = /^\s*(Error|Fatal)\b/;

/** The printed energy (per metre of depth, planar; per radian, axisymmetric) and the mesh's node count. */
export async function solveStoredEnergy(geometry: string, problem: string): Promise<{ energy: number; nodes: number }> {
  return withSolverFolder({ 'core.geo': geometry, 'core.pro': problem }, async (folder) => {
    const meshLog = await folder.run({
      program: 'gmsh',
      args: ['-2', '{folder}/core.geo', '-o', '{folder}/core.msh'],
      timeoutMs: TIMEOUT_MS,
      errorLine: SOLVER_ERROR,
    });
    await folder.run({
      program: 'getdp',
      args: ['{folder}/core.pro', '-msh', '{folder}/core.msh', '-solve', 'Magnetostatic', '-pos', 'Energy', '-name', '{folder}/run'],
      timeoutMs: TIMEOUT_MS,
      errorLine: SOLVER_ERROR,
    });
    const energy = Number((await folder.read('energy.txt')).trim().split(/\s+/).at(-1));
    return { energy, nodes: Number(/(\d+) nodes/.exec(meshLog)?.[1] ?? 0) };
  });
}
