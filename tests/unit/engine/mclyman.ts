// Inductance of a gapped core by the closed form, for checking the engine independently. Colonel Wm. T. McLyman,
// Transformer and Inductor Design Handbook, 3rd ed., Marcel Dekker 2004, ch. 8: fringing factor
// F = 1 + (lg/√Ae)·ln(2G/lg), G the window height; L = μ0·N²·Ae·F/(lg + le/μr).
import { MU0 } from '@shared/engine/constants';
import type { CoreMaterial, CoreShape } from '@shared/engine/types';

export const fringing = (gap: number, area: number, windowHeight: number) =>
  1 + (gap / Math.sqrt(area)) * Math.log((2 * windowHeight) / gap);

/** One ground gap across the centre leg. */
export const groundLOf = (core: CoreShape, material: CoreMaterial, turns: number, gap: number) =>
  (MU0 * turns * turns * core.ae * fringing(gap, core.ae, core.windowHeight)) / (gap + core.le / material.permeability);

/** A spacer t under all legs: gaps t across Ae and t across Ao = Ae/(Ac/Ao) in series, each with its own F. */
export function spacerLOf(core: CoreShape, material: CoreMaterial, turns: number, t: number): number {
  const outer = core.ae / (core.centreToOuterLegAreaRatio ?? 1);
  const path =
    core.le / (material.permeability * core.ae) +
    t / (core.ae * fringing(t, core.ae, core.windowHeight)) +
    t / (outer * fringing(t, outer, core.windowHeight));
  return (MU0 * turns * turns) / path;
}
