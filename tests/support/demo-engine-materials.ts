// The invented demo materials in the engine's form, for engine tests that need the demo library without a
// database (the seed writes the same numbers to the materials table).
import type { CoreMaterial } from '@shared/engine/types';
import { rollOffToEngine } from '@shared/fitting/rolloff-fit';
import { behaviourToQuadratic } from '@shared/fitting/temperature-fit';
import { DEMO_MATERIALS, kFromAnchor } from '../../server/seed/demo-materials.ts';

export const DEMO_ENGINE_MATERIALS: readonly CoreMaterial[] = DEMO_MATERIALS.map((m, i) => {
  const t = m.minimumLossAt;
  return {
    id: `demo-${i + 1}`,
    name: m.name,
    family: m.family,
    k: kFromAnchor(m),
    alpha: m.alpha,
    beta: m.beta,
    fitFrequencyMin: m.fit.fMin,
    fitFrequencyMax: m.fit.fMax,
    fitFluxMin: m.fit.bMin,
    fitFluxMax: m.fit.bMax,
    // As the seed stores them: factor 1 at the minimum, where k holds.
    ...(t
      ? { tempCoefficients: behaviourToQuadratic({ lowestLossTemperature: t.temperature, lowestLossFactor: 1, curvature: t.curvature }) }
      : {}),
    bsat25: m.bsat25,
    bsat100: m.bsat100,
    permeability: m.permeability,
    ...(m.rollOff ? { rollOff: rollOffToEngine({ halfField: m.rollOff.h50, steepness: m.rollOff.c }) } : {}),
    density: m.density,
    ...(m.maxTemperature ? { maxTemperature: m.maxTemperature } : {}),
  };
});
