// Turns, gap and inductance of one core × material, independent of the wire: an air-gap core with a ground centre
// gap or a spacer under all legs, or a distributed-gap (powder) core. evaluateCandidate takes the result as given.
import { FRINGING_VALIDITY_LIMIT } from './constants';
import {
  gappedInductance,
  gappedInductanceFactor,
  gapWithFringing,
  minimumTurnsUngapped,
  spacerEquivalentGap,
  spacerForInductance,
  spacerInductance,
  turnsForFluxLimit,
  turnsForGap,
  turnsForSpacer,
  type GapGeometry,
} from './gap';
import { FAILURE, WARNING, type SpecContext } from './kernel';
import { biasedFlux, biasedInductance, permeabilityFraction, powderInductanceFactor, powderTurns } from './powder';
import { fluxDensity, saturationFlux } from './saturation';
import type { CoreMaterial, CoreShape, GapPlacement } from './types';

/** Turns, gap and inductance of one core × material, independent of the wire. */
export interface MagneticDesign {
  kind: 'air-gap' | 'distributed';
  /** Where the gap is made; 'ground' for distributed-gap cores, which have none. */
  placement: GapPlacement;
  turns: number;
  /** Sum of the gap lengths the flux crosses: the ground gap, or twice the spacer (centre and outer legs). */
  totalGap: number;
  /** Spacer thickness: the design's own spacer, or for a ground gap the spacer that gives the same inductance. */
  spacer: number;
  /** Largest t/√A over the gaps (the fringing formula is trusted below 0.3). */
  relativeGap: number;
  /** Effective fringing factor: L with fringing over L without. */
  fringingFactor: number;
  inductanceFactorWithoutFringing: number;
  inductanceFactor: number;
  /** Nominal inductance at zero bias, at full load and at the saturation-check peak (H). */
  inductanceZeroBias: number;
  inductanceAtLoad: number;
  inductanceAtPeak: number;
  /** L(peak)/L(0). */
  permeabilityAtPeak: number;
  /** Nominal core flux density at full load and at the saturation-check current (T). */
  fluxAtLoad: number;
  fluxAtPeak: number;
  /** ΔL/L for 10 µm more gap (ground) or spacer; 0 for distributed-gap cores. Negative: L falls. */
  gapSensitivity: number;
  failures: number;
  warnings: number;
}

export type TurnsInput = number | 'auto';

/** Gap step of the sensitivity figure: what a grinder or a spacer foil may be off by (common practice, no source). */
export const GAP_SENSITIVITY_STEP = 10e-6;
/** |ΔL/L| for one sensitivity step above which the part is flagged as hard to build to tolerance (common practice, no source). */
export const GAP_SENSITIVITY_LIMIT = 0.1;

/** Most turns whose copper (Irms/J each) fits the usable window. */
export function windowTurnLimit(core: CoreShape, ctx: SpecContext): number {
  const perTurn = ctx.op.rmsCurrent / ctx.limits.currentDensity;
  return Math.max(1, Math.floor((ctx.limits.windowUtilisation * core.windowArea) / perTurn));
}

/**
 * Turns and gap of one core × material. For air-gap cores `gapInput` is the ground gap (placement 'ground') or the
 * spacer thickness (placement 'spacer'); distributed-gap cores ignore both. `spacerAlternative` false leaves a ground
 * design's same-L spacer at 0: the search's sweep never reads it (only a built result does) and it costs a bisection.
 */
export function designMagnetics(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput = 'auto',
  gapInput: TurnsInput = 'auto',
  placement: GapPlacement = 'ground',
  spacerAlternative = true,
): MagneticDesign {
  return core.gapKind === 'distributed'
    ? designDistributed(core, material, ctx, turnsInput)
    : designAirGap(core, material, ctx, turnsInput, gapInput, placement, spacerAlternative);
}

function designDistributed(core: CoreShape, material: CoreMaterial, ctx: SpecContext, turnsInput: TurnsInput): MagneticDesign {
  const { op, limits } = ctx;
  const target = op.inductanceNominal;
  const al = powderInductanceFactor(material.permeability, core.ae, core.le);
  let failures = 0;
  let turns: number;
  if (turnsInput === 'auto') {
    const result = powderTurns(target, op.saturationCheckCurrent, al, core.le, material.rollOff, windowTurnLimit(core, ctx));
    turns = result.turns;
    if (!result.feasible) failures |= FAILURE.powderLimit;
  } else {
    turns = turnsInput;
  }
  const inductanceZeroBias = al * turns * turns;
  const inductanceAtPeak = biasedInductance(turns, op.saturationCheckCurrent, al, core.le, material.rollOff);
  const inductanceAtLoad = biasedInductance(turns, op.ioutMax, al, core.le, material.rollOff);
  if (inductanceAtPeak * (1 - limits.inductanceTolerance) < op.inductanceMin * (1 - 1e-9) && !(failures & FAILURE.powderLimit)) {
    failures |= FAILURE.inductanceShort;
  }
  const permeabilityAtPeak = permeabilityFraction(material.rollOff, (turns * op.saturationCheckCurrent) / core.le);
  if (permeabilityAtPeak < limits.minPermeabilityAtPeak) failures |= FAILURE.permeabilityDrop;
  return {
    kind: 'distributed',
    placement: 'ground',
    turns,
    totalGap: 0,
    spacer: 0,
    relativeGap: 0,
    fringingFactor: 1,
    inductanceFactorWithoutFringing: al,
    inductanceFactor: al,
    inductanceZeroBias,
    inductanceAtLoad,
    inductanceAtPeak,
    permeabilityAtPeak,
    // The roll-off curve is the incremental permeability: the flux is its integral, not μ%(H)·H.
    fluxAtLoad: biasedFlux(turns, op.ioutMax, material.permeability, core.le, material.rollOff),
    fluxAtPeak: biasedFlux(turns, op.saturationCheckCurrent, material.permeability, core.le, material.rollOff),
    gapSensitivity: 0,
    failures,
    warnings: 0,
  };
}

/** L of an air-gap core: one fringing ground gap across Ae, or a spacer's two fringing gaps in series. */
function airGapInductance(turns: number, gap: number, placement: GapPlacement, g: GapGeometry, ratio: number): number {
  return placement === 'spacer'
    ? spacerInductance(turns, gap, g, ratio)
    : gappedInductance(turns, gap, g.area, g.pathLength, g.permeability, g.windowHeight);
}

function designAirGap(
  core: CoreShape,
  material: CoreMaterial,
  ctx: SpecContext,
  turnsInput: TurnsInput,
  gapInput: TurnsInput,
  placement: GapPlacement,
  spacerAlternative: boolean,
): MagneticDesign {
  const { op, limits } = ctx;
  const target = op.inductanceNominal;
  const geometry: GapGeometry = {
    area: core.ae,
    pathLength: core.le,
    windowHeight: core.windowHeight,
    permeability: material.permeability,
  };
  const ratio = core.centreToOuterLegAreaRatio ?? 1;
  const spacer = placement === 'spacer';
  let failures = 0;
  let warnings = 0;
  let turns: number;
  if (turnsInput !== 'auto') turns = turnsInput;
  else if (gapInput !== 'auto')
    turns = spacer ? turnsForSpacer(target, gapInput, geometry, ratio) : turnsForGap(target, gapInput, geometry);
  else {
    // The flux limit at nominal L, and saturation margin kept by the upper-tolerance part at the hottest allowed
    // temperature in the narrowest section (the worst-case corner evaluateCandidate checks).
    const allowedFlux = saturationFlux(material, ctx.hottestAllowed) * (1 - limits.saturationMargin);
    const worstCase =
      allowedFlux > 0
        ? turnsForFluxLimit(
            target * (1 + limits.inductanceTolerance),
            op.saturationCheckCurrent,
            allowedFlux,
            Math.min(core.amin ?? core.ae, core.ae),
          )
        : 1;
    turns = Math.max(
      turnsForFluxLimit(target, op.saturationCheckCurrent, limits.bMax, core.ae),
      worstCase,
      minimumTurnsUngapped(target, geometry),
    );
  }
  // The ground gap, or the spacer thickness.
  let gap: number;
  if (gapInput !== 'auto') gap = gapInput;
  else {
    gap = spacer ? spacerForInductance(turns, target, geometry, ratio) : gapWithFringing(turns, target, geometry);
    if (gap < 0) {
      failures |= FAILURE.negativeGap;
      gap = 0;
    }
  }
  const inductance = airGapInductance(turns, gap, placement, geometry, ratio);
  if (inductance * (1 - limits.inductanceTolerance) < op.inductanceMin * (1 - 1e-6)) failures |= FAILURE.inductanceShort;
  // An exactly zero gap is an ungapped set (nothing to grind); any other gap must be one a workshop can hold.
  if (gap > 0 && gap < limits.minGap) failures |= FAILURE.gapTooSmall;
  const relativeGap = spacer ? gap / Math.sqrt(Math.min(core.ae, core.ae / ratio)) : gap / Math.sqrt(core.ae);
  if (relativeGap > FRINGING_VALIDITY_LIMIT) warnings |= WARNING.fringingRange;
  const gapSensitivity = airGapInductance(turns, gap + GAP_SENSITIVITY_STEP, placement, geometry, ratio) / inductance - 1;
  if (Math.abs(gapSensitivity) > GAP_SENSITIVITY_LIMIT) warnings |= WARNING.gapSensitive;
  const withoutFringing = gappedInductanceFactor(
    spacer ? spacerEquivalentGap(gap, ratio) : gap,
    core.ae,
    core.le,
    material.permeability,
    core.windowHeight,
    false,
  );
  const inductanceFactor = inductance / (turns * turns);
  return {
    kind: 'air-gap',
    placement,
    turns,
    totalGap: spacer ? 2 * gap : gap,
    spacer: spacer ? gap : spacerAlternative ? Math.max(0, spacerForInductance(turns, inductance, geometry, ratio)) : 0,
    relativeGap,
    fringingFactor: inductanceFactor / withoutFringing,
    inductanceFactorWithoutFringing: withoutFringing,
    inductanceFactor,
    inductanceZeroBias: inductance,
    inductanceAtLoad: inductance,
    inductanceAtPeak: inductance,
    permeabilityAtPeak: 1,
    fluxAtLoad: fluxDensity(inductance, op.ioutMax, turns, core.ae),
    fluxAtPeak: fluxDensity(inductance, op.saturationCheckCurrent, turns, core.ae),
    gapSensitivity,
    failures,
    warnings,
  };
}
