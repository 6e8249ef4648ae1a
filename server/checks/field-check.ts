// The field check of a saved design: its 2-D field model (server/solvers/field/) solved magnetostatically and at the
// switching frequency and its second and third harmonics, each figure beside the engine's, and the flux-line picture.
// E and EFD cores are modelled as a planar section through both windows (per-metre figures × the stated depth);
// every other shape as a body of revolution. Bad geometry is refused by field before any solver runs.
import type { EvaluationResult } from '@shared/engine/index';
import type { CentreLeg } from '@shared/catalogue/bobbin-estimate';
import type { CoreFamily, CoreShape, WireOption } from '@shared/engine/types';
import type { FieldCheckResult } from '@shared/schemas/checks';
import { checkDesign } from '../solvers/field/design-check.ts';
import { fluxPicture } from '../solvers/field/flux-picture.ts';

export interface FieldCheckInput {
  evaluation: EvaluationResult;
  core: CoreShape;
  wire: WireOption;
  permeability: number;
  /** The core's centre leg from the catalogue (the planar model's leg width); absent for a user core. */
  centreLeg?: CentreLeg;
  title: string;
  /** Harmonics solved (default the switching frequency and its next two). */
  harmonics?: number[];
}

export interface FieldCheckRun {
  onProgress: (progress: number) => Promise<void>;
}

/** Harmonics of the switching frequency solved: a triangular ripple's largest three (common practice, no source). */
const HARMONICS = [1, 2, 3];

/** Families with a rectangular centre leg, modelled as a planar section; all others as a body of revolution. */
export const PLANAR_FAMILIES: readonly CoreFamily[] = ['E', 'EFD'];

/** The planar model's centre-leg width: the catalogue's; a user core without one gets a square leg of its Ae. */
export function planarOf(core: CoreShape, centreLeg: CentreLeg | undefined): { legWidth: number } | undefined {
  if (!PLANAR_FAMILIES.includes(core.family)) return undefined;
  return { legWidth: centreLeg?.shape === 'rect' ? centreLeg.width : Math.sqrt(core.ae) };
}

const COMMON_NOTES = [
  'Wires in hand are separate round conductors sharing the turn current equally; litz is not modelled.',
  'Peak |B| at the gap’s corners grows as the mesh is refined; compare the centre-leg mean with the engine’s flux.',
];

const mm = (x: number) => `${(x * 1e3).toFixed(x < 10e-3 ? 2 : 1)} mm`;

function modelNotes(planar: { legWidth: number } | undefined, depth: number | undefined, centreLeg: CentreLeg | undefined): string[] {
  if (!planar || depth === undefined)
    return ['The core is modelled as a body of revolution with the centre leg’s own area (axisymmetric model).', ...COMMON_NOTES];
  return [
    `Planar model, depth ${mm(depth)}: a section through both windows, the centre leg ${mm(planar.legWidth)} wide` +
      `${centreLeg?.shape === 'rect' ? '' : ' (no catalogue leg width: a square leg of Ae)'}, the depth Ae/width so the leg’s ` +
      'area is the engine’s Ae; figures per metre × depth. End turns outside the core are not modelled.',
    'The gap fringes only at the two leg faces in the section, not at the front and back faces: the field’s L is ' +
      'below a fringing factor over the whole leg perimeter.',
    'AC resistance: the engine’s side is Dowell’s factor times the model’s own DC resistance (the straight runs, 2 × depth per turn).',
    ...COMMON_NOTES,
  ];
}

export async function runFieldCheck(input: FieldCheckInput, run: FieldCheckRun): Promise<FieldCheckResult> {
  await run.onProgress(0.05);
  const planar = planarOf(input.core, input.centreLeg);
  const check = await checkDesign({
    result: input.evaluation,
    core: input.core,
    wire: input.wire,
    permeability: input.permeability,
    harmonics: input.harmonics ?? HARMONICS,
    ...(planar ? { planar } : {}),
  });
  await run.onProgress(0.95);
  const model = check.field.model;
  const depth = model.kind === 'planar' ? model.depth : undefined;
  return {
    kind: 'field',
    model: model.kind,
    ...(depth === undefined ? {} : { depth }),
    inductance: check.inductance,
    peakFlux: check.peakFlux,
    peakFluxLocal: check.peakFluxLocal,
    acResistance: check.acResistance.map(({ harmonic, engine, field, difference, fieldLayers }) => ({
      harmonic,
      frequency: harmonic * input.evaluation.operatingPoint.frequency,
      engine,
      field,
      difference,
      fieldLayers,
    })),
    dcResistance: check.field.dcResistance,
    nodes: check.field.nodes,
    seconds: check.field.seconds.mesh + check.field.seconds.static + check.field.seconds.harmonic,
    notes: modelNotes(planar, depth, input.centreLeg),
    picture: fluxPicture({ ...check.field.picture, title: input.title }),
  };
}
