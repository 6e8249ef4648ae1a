// A design the engine evaluated, checked by the field model: the engine's result gives the model (core, gap and
// placement, turns, the layout it chose, the wire), the field solution gives inductance, flux density and AC
// resistance, and each figure sits beside the engine's with the difference. The copper resistivity is the one behind
// the engine's own skin depth (ρ = π·f·μ0·δ²), so both AC figures are at the same copper temperature.
import { MU0 } from '@shared/engine/constants';
import { dowellFactor } from '@shared/engine/dowell';
import type { EvaluationResult } from '@shared/engine/evaluate';
import type { CoreShape, WireOption } from '@shared/engine/types';
import { COPPER_RESISTIVITY_20C } from '@shared/engine/constants';
import type { FieldDesignInput } from './design-model.ts';
import { solveFieldDesign, type FieldDesignResult } from './design-field.ts';

export interface DesignCheckInput {
  result: EvaluationResult;
  core: CoreShape;
  wire: WireOption;
  permeability: number;
  /** Harmonics of the switching frequency solved (default the fundamental only). */
  harmonics?: number[];
  clearance?: number;
  refinement?: number;
  /** E and EFD: the planar model with the rectangular centre leg's width (m); absent: the body of revolution. */
  planar?: { legWidth: number };
}

export interface FigurePair {
  engine: number;
  field: number;
  /** (field − engine)/engine. */
  difference: number;
}

export interface DesignCheck {
  inductance: FigurePair;
  /** Engine: the section-mean peak flux; field: the centre leg's mean |B| at the same current. */
  peakFlux: FigurePair;
  /** Largest |B| over the core's elements at the check current (at the gap's corners; grows with mesh refinement). */
  peakFluxLocal: number;
  /**
   * At each harmonic: engine R_dc·Dowell's Fr for its layers against the field's total loss over I_rms². Planar: the
   * model holds each turn's two straight runs through the core only (2·depth, no end turns), so the engine's side is
   * Dowell's Fr times the model's own R_dc (the same copper), not the engine's R_dc over the whole mean turn.
   */
  acResistance: (FigurePair & { harmonic: number; fieldLayers: number[] })[];
  field: FieldDesignResult;
}

export function fieldDesignOf(input: DesignCheckInput): FieldDesignInput {
  const { result, core, wire } = input;
  return {
    core,
    permeability: input.permeability,
    gap: { placement: result.gap.placement, length: result.gap.placement === 'spacer' ? result.gap.spacer : result.gap.total },
    turns: result.turns,
    winding: { turnsPerLayer: result.winding.turnsPerLayer, layers: result.winding.layers },
    wire,
    ...(input.clearance === undefined ? {} : { clearance: input.clearance }),
    ...(input.refinement === undefined ? {} : { refinement: input.refinement }),
    ...(input.planar === undefined ? {} : { planar: input.planar }),
  };
}

const pair = (engine: number, field: number): FigurePair => ({ engine, field, difference: field / engine - 1 });

export async function checkDesign(input: DesignCheckInput): Promise<DesignCheck> {
  const { result } = input;
  const fs = result.operatingPoint.frequency;
  const harmonics = input.harmonics ?? [1];
  const resistivity = Math.PI * fs * MU0 * result.copper.skinDepth ** 2;
  const field = await solveFieldDesign(fieldDesignOf(input), { resistivity, frequencies: harmonics.map((h) => h * fs) });
  const current = result.flux.checkCurrent;
  const engineDc = input.planar ? field.dcResistance : result.copper.resistance20 * (resistivity / COPPER_RESISTIVITY_20C);
  return {
    inductance: pair(result.inductance.nominal, field.inductance),
    peakFlux: pair(result.flux.peak, field.legFluxPerAmp * current),
    peakFluxLocal: field.peakFluxPerAmp * current,
    acResistance: field.harmonics.map((h, i) => ({
      harmonic: harmonics[i]!,
      ...pair(engineDc * dowellFactor(result.copper.penetrationRatio * Math.sqrt(harmonics[i]!), result.winding.layers), h.resistance),
      fieldLayers: h.layers,
    })),
    field,
  };
}
