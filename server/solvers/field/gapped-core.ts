// A gapped round-leg core as a body of revolution for the 2D axisymmetric field model: the centre leg a cylinder of
// the core's own area Ae, the window its height G and width (window area / G), the outer leg a ring of area
// Ae / (Ac/Ao), top and bottom plates as thick as carry the centre leg's flux at mid-window radius, and the winding
// a uniform block in the window 0.5 mm clear of the core. Only the half above the gap's mid-plane is modelled (the
// field crosses that plane at right angles, GetDP's natural boundary). Every region is a union of cells of one
// rectangular grid, so the mesh is conforming without boolean operations and each region is known by construction.
import type { CoreShape } from '@shared/engine/types';
import { solveStoredEnergy } from './energy-solve.ts';
import { jacobianAndIntegration, magnetostaticFormulation, VECTOR_POTENTIAL_SPACE, MAGNETOSTATIC_ENERGY } from './getdp-text.ts';

export interface GappedCoreModel {
  core: Pick<CoreShape, 'ae' | 'windowArea' | 'windowHeight' | 'centreToOuterLegAreaRatio'>;
  permeability: number;
  turns: number;
  /** Total centre-leg gap (m); 0 for an ungapped core. */
  gap: number;
  /** Mesh refinement (1 = default; 2 halves every element size). */
  refinement?: number;
}

export interface GappedCoreField {
  /** From the stored energy at 1 A, L = 2·W (H). */
  inductance: number;
  nodes: number;
}

/** The body of revolution (m). */
export interface RevolvedCore {
  legRadius: number;
  windowInner: number;
  windowOuter: number;
  outerRadius: number;
  halfWindow: number;
  plate: number;
}

const CLEARANCE = 0.5e-3;
const n = (x: number) => x.toPrecision(12);

export function revolvedCore(core: GappedCoreModel['core']): RevolvedCore {
  const legRadius = Math.sqrt(core.ae / Math.PI);
  const width = core.windowArea / core.windowHeight;
  const windowOuter = legRadius + width;
  const outerArea = core.ae / (core.centreToOuterLegAreaRatio ?? 1);
  return {
    legRadius,
    windowInner: legRadius,
    windowOuter,
    outerRadius: Math.sqrt(windowOuter * windowOuter + outerArea / Math.PI),
    halfWindow: core.windowHeight / 2,
    plate: core.ae / (2 * Math.PI * (legRadius + width / 2)),
  };
}

type Region = 'core' | 'winding' | 'air';

interface Grid {
  rs: number[];
  zs: number[];
  regionOf(r: number, z: number): Region;
  /** Element size wanted at a grid point. */
  sizeAt(r: number, z: number): number;
}

function grid(model: GappedCoreModel): Grid {
  const c = revolvedCore(model.core);
  const refinement = model.refinement ?? 1;
  const halfGap = model.gap / 2;
  const top = c.halfWindow + c.plate;
  const air = 4 * Math.max(c.outerRadius, top);
  const rs = [0, c.legRadius, c.legRadius + CLEARANCE, c.windowOuter - CLEARANCE, c.windowOuter, c.outerRadius, air];
  const zs = [0, ...(halfGap > 0 ? [halfGap] : []), c.halfWindow - CLEARANCE, c.halfWindow, top, air];
  const coarse = Math.min(c.windowOuter - c.legRadius, c.halfWindow) / (16 * refinement);
  const fine = halfGap > 0 ? Math.min(halfGap / 2, coarse) / refinement : coarse;
  return {
    rs,
    zs,
    regionOf(r, z) {
      const inPlate = z > c.halfWindow && z < top && r < c.outerRadius;
      const inLeg = r < c.legRadius && z > halfGap && z < top;
      const inOuter = r > c.windowOuter && r < c.outerRadius && z < top;
      if (inPlate || inLeg || inOuter) return 'core';
      if (r > c.legRadius + CLEARANCE && r < c.windowOuter - CLEARANCE && z < c.halfWindow - CLEARANCE) return 'winding';
      return 'air';
    },
    sizeAt(r, z) {
      if (r >= air || z >= air) return air / (10 * refinement);
      // Fine where the gap's field fringes: along the gap faces and around the leg's corner.
      return z <= halfGap + 1e-12 && r <= c.legRadius + 1e-12 ? fine : coarse;
    },
  };
}

export function gappedCoreGeometry(model: GappedCoreModel): { geometry: string; windingArea: number } {
  const g = grid(model);
  const lines = ['// Gapwright gapped core, axisymmetric half (generated); r along x, z along y, lengths in m'];
  const point = (i: number, j: number) => 1 + i + j * g.rs.length;
  g.zs.forEach((z, j) => g.rs.forEach((r, i) => lines.push(`Point(${point(i, j)}) = {${n(r)}, ${n(z)}, 0, ${n(g.sizeAt(r, z))}};`)));
  // Horizontal line from (i, j) to (i+1, j), vertical from (i, j) to (i, j+1).
  const across = (i: number, j: number) => 1 + i + j * g.rs.length;
  const up = (i: number, j: number) => 100000 + i + j * g.rs.length;
  for (let j = 0; j < g.zs.length; j++)
    for (let i = 0; i + 1 < g.rs.length; i++) lines.push(`Line(${across(i, j)}) = {${point(i, j)}, ${point(i + 1, j)}};`);
  for (let j = 0; j + 1 < g.zs.length; j++)
    for (let i = 0; i < g.rs.length; i++) lines.push(`Line(${up(i, j)}) = {${point(i, j)}, ${point(i, j + 1)}};`);
  const regions: Record<Region, number[]> = { core: [], winding: [], air: [] };
  let windingArea = 0;
  for (let j = 0; j + 1 < g.zs.length; j++) {
    for (let i = 0; i + 1 < g.rs.length; i++) {
      const surface = 1 + i + j * g.rs.length;
      lines.push(
        `Curve Loop(${surface}) = {${across(i, j)}, ${up(i + 1, j)}, -${across(i, j + 1)}, -${up(i, j)}};`,
        `Plane Surface(${surface}) = {${surface}};`,
      );
      const region = g.regionOf((g.rs[i]! + g.rs[i + 1]!) / 2, (g.zs[j]! + g.zs[j + 1]!) / 2);
      regions[region].push(surface);
      if (region === 'winding') windingArea += (g.rs[i + 1]! - g.rs[i]!) * (g.zs[j + 1]! - g.zs[j]!);
    }
  }
  const last = { i: g.rs.length - 1, j: g.zs.length - 1 };
  const axis = g.zs.slice(0, -1).map((_, j) => up(0, j));
  const outer = [...g.zs.slice(0, -1).map((_, j) => up(last.i, j)), ...g.rs.slice(0, -1).map((_, i) => across(i, last.j))];
  lines.push(
    `Physical Surface(1) = {${regions.core.join(', ')}};`,
    `Physical Surface(2) = {${regions.winding.join(', ')}};`,
    `Physical Surface(3) = {${regions.air.join(', ')}};`,
    `Physical Curve(4) = {${axis.join(', ')}};`,
    `Physical Curve(5) = {${outer.join(', ')}};`,
    'Mesh.MshFileVersion = 2.2;',
    '',
  );
  return { geometry: lines.join('\n'), windingArea };
}

/** Axisymmetric A-formulation (VolAxiSqu); the energy integral is per radian and for the half model. */
export function gappedCoreProblem(model: GappedCoreModel, windingArea: number): string {
  return `// Gapwright gapped core, axisymmetric magnetostatics (generated)
Group {
  Core = Region[1]; Winding = Region[2]; Air = Region[3]; Axis = Region[4]; Boundary = Region[5];
  Domain = Region[{Core, Winding, Air}];
}
Function {
  mu0 = 4e-7*Pi;
  nu[Region[{Air, Winding}]] = 1/mu0;
  nu[Core] = 1/(mu0*${n(model.permeability)});
  // The half model holds half the turns: N·I spread over twice the half window's winding block.
  js[Winding] = Vector[0, 0, ${n(model.turns / (2 * windingArea))}];
}
Constraint { { Name Dirichlet; Case { { Region Boundary; Value 0; } { Region Axis; Value 0; } } } }
${jacobianAndIntegration('VolAxiSqu')}
FunctionSpace {
${VECTOR_POTENTIAL_SPACE}
}
Formulation {
${magnetostaticFormulation('Winding')}
}
${MAGNETOSTATIC_ENERGY}
`;
}

/** L = 2·W at 1 A, W = 2 (halves) × 2π (radians) × the printed energy. */
export async function solveGappedCore(model: GappedCoreModel): Promise<GappedCoreField> {
  const { geometry, windingArea } = gappedCoreGeometry(model);
  const { energy, nodes } = await solveStoredEnergy(geometry, gappedCoreProblem(model, windingArea));
  return { inductance: 2 * 2 * 2 * Math.PI * energy, nodes };
}
