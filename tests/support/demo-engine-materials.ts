// The invented demo materials in the engine's form, for engine tests that need the demo library without a
// database (the seed writes the same numbers to the materials table).
import type { CoreMaterial } from '@shared/engine/types';
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
    ...(t ? { tempCoefficients: { ct2: t.ct2, ct1: 2 * t.ct2 * t.temperature, ct0: 1 + t.ct2 * t.temperature ** 2 } } : {}),
    bsat25: m.bsat25,
    bsat100: m.bsat100,
    permeability: m.permeability,
    ...(m.rollOff ? { rollOff: { a: 1, b: m.rollOff.h50 ** -m.rollOff.c, c: m.rollOff.c } } : {}),
    density: m.density,
    ...(m.maxTemperature ? { maxTemperature: m.maxTemperature } : {}),
  };
});
