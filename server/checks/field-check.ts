// The field check of a saved design: its axisymmetric field model (server/solvers/field/) solved magnetostatically and
// at the switching frequency and its second and third harmonics, each figure beside the engine's, and the flux-line
// picture. Bad geometry is refused by field before any solver runs.
import type { EvaluationResult } from '@shared/engine/index';
import type { CoreShape, WireOption } from '@shared/engine/types';
import type { FieldCheckResult } from '@shared/schemas/checks';
import { checkDesign } from '../solvers/field/design-check.ts';
import { fluxPicture } from '../solvers/field/flux-picture.ts';

export interface FieldCheckInput {
  evaluation: EvaluationResult;
  core: CoreShape;
  wire: WireOption;
  permeability: number;
  title: string;
  /** Harmonics solved (default the switching frequency and its next two). */
  harmonics?: number[];
}

export interface FieldCheckRun {
  onProgress: (progress: number) => Promise<void>;
}

/** Harmonics of the switching frequency solved: a triangular ripple's largest three (common practice, no source). */
const HARMONICS = [1, 2, 3];

const NOTES = [
  'The core is modelled as a body of revolution with the centre leg’s own area; E and EFD shapes are approximated the same way.',
  'Wires in hand are separate round conductors sharing the turn current equally; litz is not modelled.',
  'Peak |B| at the gap’s corners grows as the mesh is refined; compare the centre-leg mean with the engine’s flux.',
];

export async function runFieldCheck(input: FieldCheckInput, run: FieldCheckRun): Promise<FieldCheckResult> {
  await run.onProgress(0.05);
  const check = await checkDesign({
    result: input.evaluation,
    core: input.core,
    wire: input.wire,
    permeability: input.permeability,
    harmonics: input.harmonics ?? HARMONICS,
  });
  await run.onProgress(0.95);
  return {
    kind: 'field',
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
    notes: NOTES,
    picture: fluxPicture({ ...check.field.picture, title: input.title }),
  };
}
