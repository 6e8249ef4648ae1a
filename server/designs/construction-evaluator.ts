import { gapInputOf } from '@shared/engine/types';
import type { Construction, DesignSpec, StoredResult } from '@shared/schemas/designs';
import type { CalcService } from '../calc/calc.service.ts';

export interface EvaluatedConstruction {
  construction: Construction;
  result: StoredResult;
  engineVersion: string;
  materialId: number;
}

/**
 * Runs the engine on a design's construction before it is saved; turns, gap and placement are stored as the engine
 * resolved them. A keep-out is stored when the construction gives one (a search pick beyond the limit's); without
 * one the design follows its limits' keepOut.
 */
export class ConstructionEvaluator {
  constructor(private readonly calc: CalcService) {}

  async evaluate(spec: DesignSpec, construction: Construction): Promise<EvaluatedConstruction> {
    const {
      wire,
      result: evaluation,
      engineVersion,
    } = await this.calc.evaluate(
      {
        spec: spec.converter,
        limits: spec.limits,
        coreId: construction.coreId,
        materialId: construction.materialId,
        turns: construction.turns,
        gap: construction.gap,
        placement: construction.placement,
        keepOut: construction.keepOut,
        wire: construction.wire,
      },
      {},
    );
    // The gap is stored as the engine input it resolved to: the ground gap, or the spacer thickness.
    const gap = gapInputOf(evaluation.gap);
    return {
      construction: { ...construction, turns: evaluation.turns, gap, placement: evaluation.gap.placement },
      result: { wire, evaluation },
      engineVersion,
      materialId: Number(construction.materialId),
    };
  }
}
