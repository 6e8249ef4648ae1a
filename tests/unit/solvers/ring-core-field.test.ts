import { describe, expect, it } from 'vitest';
import { solveRingCore, type RingCore } from '../../../server/solvers/field/ring-core.ts';

// The 2D field model (gmsh meshes, GetDP solves; both from Debian's packages) checked on a closed form before it is
// trusted on a design: an ungapped ring core of rectangular cross-section has L = μ0·μr·N²·h·ln(ro/ri)/(2π)
// (Ampère's law around the core, H = N·I/(2πr); any electromagnetics text, e.g. D. K. Cheng, Field and Wave
// Electromagnetics, 2nd ed., Addison-Wesley 1989, the toroid example — from memory). The air between the current
// sheets and the core adds about 0.005 % at μr = 2000 here. Mesh convergence: halving every element size must
// change L by less than 0.2 %.

const ring: RingCore = { innerRadius: 0.01, outerRadius: 0.016, height: 0.008, permeability: 2000, turns: 20 };

describe('ring core: field solution against the closed form', () => {
  it('agrees within 1 %, and the mesh is converged', async () => {
    const coarse = await solveRingCore(ring, 1);
    expect(Math.abs(coarse.inductance / coarse.closedForm - 1)).toBeLessThan(0.01);
    const fine = await solveRingCore(ring, 2);
    expect(fine.nodes).toBeGreaterThan(2 * coarse.nodes);
    expect(Math.abs(fine.inductance / coarse.inductance - 1)).toBeLessThan(0.002);
  }, 120_000);

  it('follows the permeability: μr 200 gives a tenth of μr 2000 (within 0.1 %)', async () => {
    const [high, low] = await Promise.all([solveRingCore(ring), solveRingCore({ ...ring, permeability: 200 })]);
    expect(Math.abs(low.inductance / high.inductance - 0.1)).toBeLessThan(1e-3);
  }, 120_000);
});
