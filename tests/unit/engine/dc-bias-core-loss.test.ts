import { describe, expect, it } from 'vitest';
import { MU0 } from '@shared/engine/constants';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { lossMap } from '@shared/engine/load-map';
import { etd34Like, ferriteA, powderP, powderRing, roundWire, sectionOneSpec, workedDesign } from './fixtures';

// Core loss under DC bias (Mühlethaler, Biela, Kolar and Ecklebe, IEEE Trans. Power Electronics 27(2), 2012: the
// Steinmetz parameters depend on the DC field H_dc in the material), here as the factor 1 + (H/H₂)^m on k. The
// material's H₂ and m below are invented.
const biasLoss = { doublingField: 60, steepness: 1.5 };
const base: EvaluateInput = { ...workedDesign, material: { ...ferriteA, biasLoss } };

describe('core loss under DC bias', () => {
  it('raises a gapped ferrite core loss by 1 + (H/H₂)^m at H = B_dc/(μ0·μi), and says so', () => {
    const result = evaluateDesign(base);
    const field = result.flux.dc / (MU0 * ferriteA.permeability);
    const factor = 1 + (field / 60) ** 1.5;
    expect(result.coreLoss.dcBias!.field).toBeCloseTo(field, 9);
    expect(result.coreLoss.dcBias!.factor).toBeCloseTo(factor, 12);
    expect(result.coreLoss.loss).toBeCloseTo(result.coreLoss.igseDensity * etd34Like.ve * factor, 9);
    expect(result.coreLoss.dcBias!.included).toBe(true);
    expect(result.coreLoss.dcBias!.statement).toMatch(
      /^DC bias included: \d+ A\/m in the material at full load .* raises the core loss ×\d+\.\d\d/,
    );
    // A hotter core, so every loss that follows temperature moves too: the total is above the zero-bias design's.
    expect(result.totalLoss).toBeGreaterThan(evaluateDesign({ ...base, material: ferriteA }).totalLoss);
  });

  it('leaves a material without the data at its zero-bias loss and says that DC bias is not included', () => {
    const result = evaluateDesign({ ...base, material: ferriteA });
    expect(result.coreLoss.dcBias!.factor).toBe(1);
    expect(result.coreLoss.dcBias!.included).toBe(false);
    expect(result.coreLoss.dcBias!.statement).toMatch(/^DC bias is not included: .* has no DC-bias loss data/);
  });

  it('takes a powder core’s field as N·I/le (Ampère’s law)', () => {
    const result = evaluateDesign({
      ...base,
      core: powderRing,
      material: { ...powderP, biasLoss: { doublingField: 3000, steepness: 1 } },
      wire: roundWire(0.8e-3, 2),
    });
    const field = (result.turns * sectionOneSpec.ioutMax) / powderRing.le;
    expect(result.coreLoss.dcBias!.field).toBeCloseTo(field, 9);
    expect(result.coreLoss.dcBias!.factor).toBeCloseTo(1 + field / 3000, 12);
  });

  it('follows the load in the loss map: the full-load point carries the design’s factor, light load less', () => {
    const result = evaluateDesign(base);
    const map = lossMap(base);
    const full = map.points.find((p) => p.corner === 'max' && p.loadFraction === 1)!;
    expect(full.core / result.coreLoss.loss).toBeCloseTo(1, 2);
    const zeroBias = lossMap({ ...base, material: ferriteA });
    const light = (m: typeof map) => m.points.find((p) => p.corner === 'max' && p.loadFraction === 0.5)!.core;
    const fullOf = (m: typeof map) => m.points.find((p) => p.corner === 'max' && p.loadFraction === 1)!.core;
    // The bias raises the full-load loss more than the half-load loss (the field halves with the load).
    expect(fullOf(map) / fullOf(zeroBias)).toBeGreaterThan(light(map) / light(zeroBias));
  });
});
