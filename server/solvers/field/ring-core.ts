// The field model's first case: an ungapped ring core (rectangular cross-section, inner radius ri, outer ro, height
// h, relative permeability μr) with N turns, solved in 2D planar magnetostatics by gmsh + GetDP and compared with the
// closed form L = μ0·μr·N²·h·ln(ro/ri)/(2π). Seen from above, the turns' inner sides are a thin current sheet just
// inside the core and their outer sides one just outside, carrying N·I up and down; the field between the sheets is
// azimuthal, as in the real winding. The inductance comes from the stored energy, L = 2·W/I².
import { solveStoredEnergy } from './energy-solve.ts';
import { jacobianAndIntegration, magnetostaticFormulation, VECTOR_POTENTIAL_SPACE, MAGNETOSTATIC_ENERGY } from './getdp-text.ts';

export interface RingCore {
  innerRadius: number;
  outerRadius: number;
  height: number;
  permeability: number;
  turns: number;
}

export interface RingCoreField {
  /** From the field solution (H). */
  inductance: number;
  /** μ0·μr·N²·h·ln(ro/ri)/(2π) (H). */
  closedForm: number;
  nodes: number;
}

const MU0 = 4e-7 * Math.PI;
/** Clearance between a current sheet and the core, and the sheet's thickness, as fractions of the core's width. */
const CLEARANCE = 1 / 30;
const SHEET = 1 / 10;
/** The air boundary (A = 0) at this multiple of the outer sheet's radius. */
const AIR = 2;

export const ringCoreClosedForm = (c: RingCore) =>
  (MU0 * c.permeability * c.turns * c.turns * c.height * Math.log(c.outerRadius / c.innerRadius)) / (2 * Math.PI);

/** Radii of the seven circles (m) and the element size on each, from the core and a mesh refinement factor. */
function circles(core: RingCore, refinement: number): { radius: number; size: number }[] {
  const width = core.outerRadius - core.innerRadius;
  const [clear, sheet] = [width * CLEARANCE, width * SHEET];
  const fine = sheet / (2 * refinement);
  const coreSize = width / (12 * refinement);
  const r = [
    core.innerRadius - clear - sheet,
    core.innerRadius - clear,
    core.innerRadius,
    core.outerRadius,
    core.outerRadius + clear,
    core.outerRadius + clear + sheet,
  ];
  return [
    ...r.map((radius, i) => ({ radius, size: i === 2 || i === 3 ? coreSize : fine })),
    { radius: AIR * r[5]!, size: (AIR * r[5]!) / (10 * refinement) },
  ];
}

const n = (x: number) => x.toPrecision(12);

export function ringCoreGeometry(core: RingCore, refinement = 1): string {
  const rings = circles(core, refinement);
  const lines = ['// Gapwright ring core, planar (generated); lengths in m', `Point(1) = {0, 0, 0, ${n(rings[6]!.size)}};`];
  rings.forEach(({ radius, size }, k) => {
    const p = 10 + 10 * k;
    lines.push(
      `Point(${p + 1}) = {${n(radius)}, 0, 0, ${n(size)}};`,
      `Point(${p + 2}) = {0, ${n(radius)}, 0, ${n(size)}};`,
      `Point(${p + 3}) = {${n(-radius)}, 0, 0, ${n(size)}};`,
      `Point(${p + 4}) = {0, ${n(-radius)}, 0, ${n(size)}};`,
      ...[1, 2, 3, 4].map((a) => `Circle(${p + a}) = {${p + a}, 1, ${p + (a % 4) + 1}};`),
      `Curve Loop(${p}) = {${p + 1}, ${p + 2}, ${p + 3}, ${p + 4}};`,
    );
  });
  lines.push('Plane Surface(1) = {10};');
  for (let k = 1; k < rings.length; k++) lines.push(`Plane Surface(${k + 1}) = {${10 + 10 * k}, ${10 * k}};`);
  lines.push(
    'Physical Surface(1) = {4};',
    'Physical Surface(2) = {2};',
    'Physical Surface(3) = {6};',
    'Physical Surface(4) = {1, 3, 5, 7};',
    'Physical Curve(5) = {71, 72, 73, 74};',
    'Mesh.MshFileVersion = 2.2;',
    '',
  );
  return lines.join('\n');
}

/** Planar A-formulation: ν·curl a·curl a' = js in the sheets, a = 0 on the air boundary; energy printed to a file. */
export function ringCoreProblem(core: RingCore, refinement = 1): string {
  const rings = circles(core, refinement);
  const area = (inner: number, outer: number) => Math.PI * (outer * outer - inner * inner);
  const ampereTurns = core.turns; // I = 1 A
  return `// Gapwright ring core, planar magnetostatics (generated)
Group {
  Core = Region[1]; SheetIn = Region[2]; SheetOut = Region[3]; Air = Region[4]; Boundary = Region[5];
  Sheets = Region[{SheetIn, SheetOut}];
  Domain = Region[{Core, SheetIn, SheetOut, Air}];
}
Function {
  mu0 = 4e-7*Pi;
  nu[Region[{Air, SheetIn, SheetOut}]] = 1/mu0;
  nu[Core] = 1/(mu0*${n(core.permeability)});
  js[SheetIn] = Vector[0, 0, ${n(ampereTurns / area(rings[0]!.radius, rings[1]!.radius))}];
  js[SheetOut] = Vector[0, 0, ${n(-ampereTurns / area(rings[4]!.radius, rings[5]!.radius))}];
}
Constraint { { Name Dirichlet; Case { { Region Boundary; Value 0; } } } }
${jacobianAndIntegration('Vol')}
FunctionSpace {
${VECTOR_POTENTIAL_SPACE}
}
Formulation {
${magnetostaticFormulation('Sheets')}
}
${MAGNETOSTATIC_ENERGY}
`;
}

/** Meshes and solves the ring core; the energy per metre of depth times h gives W at I = 1 A, so L = 2·W. */
export async function solveRingCore(core: RingCore, refinement = 1): Promise<RingCoreField> {
  const { energy, nodes } = await solveStoredEnergy(ringCoreGeometry(core, refinement), ringCoreProblem(core, refinement));
  return { inductance: 2 * energy * core.height, closedForm: ringCoreClosedForm(core), nodes };
}
