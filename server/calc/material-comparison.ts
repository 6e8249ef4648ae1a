import { EngineInputError, compatible, evaluateDesign, fitRangeCheck, type ConverterSpec, type DesignLimits } from '@shared/engine/index';
import type { CoreMaterial, CoreShape, GapPlacement, WireOption } from '@shared/engine/types';
import type { DesignComparisonRow, DesignFluxPoint } from '@shared/schemas/compare';

/** One core, turn count and wire with each material: plain data, so it can cross to a worker thread. */
export interface MaterialComparisonInput {
  spec: ConverterSpec;
  limits?: Partial<DesignLimits>;
  core: CoreShape;
  turns: number;
  wire: WireOption;
  placement?: GapPlacement;
  materials: CoreMaterial[];
}

export interface MaterialComparison {
  rows: DesignComparisonRow[];
  /** The first evaluated material's flux swing and duty (where the loss curves are read). */
  fluxPoint?: DesignFluxPoint;
}

function incompatibility(core: CoreShape, material: CoreMaterial): string {
  return core.gapKind === 'distributed'
    ? `${core.id} has no air gap to set: it takes a powder material`
    : `a ${material.family} material has its gap distributed in the material: it needs a ring or toroid core, not ${core.id}`;
}

/** The gap is solved again for each material's permeability; an engine refusal becomes that material's row. */
export function compareAcrossMaterials({
  spec,
  limits,
  core,
  turns,
  wire,
  placement,
  materials,
}: MaterialComparisonInput): MaterialComparison {
  let fluxPoint: DesignFluxPoint | undefined;
  const rows = materials.map((material): DesignComparisonRow => {
    const base = { materialId: material.id, name: material.name, family: material.family };
    if (!compatible(core, material)) return { ...base, status: 'incompatible', reason: incompatibility(core, material) };
    try {
      const evaluation = evaluateDesign({ spec, limits, core, material, turns, gap: 'auto', placement, wire });
      fluxPoint ??= { deltaB: evaluation.flux.swing, frequency: spec.frequency, duty: evaluation.operatingPoint.dutyAtVinMax };
      const fit = fitRangeCheck(material, spec.frequency, evaluation.flux.acPeak);
      const errors = evaluation.issues.filter((i) => i.severity === 'error').map((i) => i.message);
      return {
        ...base,
        status: 'ok',
        feasible: evaluation.feasible,
        gap: evaluation.gap.placement === 'spacer' ? evaluation.gap.spacer : evaluation.gap.total,
        coreLoss: evaluation.coreLoss.loss,
        copperLoss: evaluation.copper.dcLoss + evaluation.copper.acLoss,
        totalLoss: evaluation.totalLoss,
        coreLossDensity: evaluation.coreLoss.igseDensity,
        peakFlux: evaluation.flux.peak,
        temperatureRise: evaluation.thermal.rise,
        extrapolated: !fit.frequencyInRange || !fit.fluxInRange,
        ...(errors.length ? { reason: errors.join(' ') } : {}),
      };
    } catch (error) {
      if (error instanceof EngineInputError) return { ...base, status: 'error', reason: error.message };
      throw error;
    }
  });
  return { rows, ...(fluxPoint ? { fluxPoint } : {}) };
}
