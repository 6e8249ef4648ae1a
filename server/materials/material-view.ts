import { referredTemperatureCoefficients } from '@shared/engine/core-loss';
import type { CoreMaterial } from '@shared/engine/types';
import type { MaterialSummary } from '@shared/schemas/material-answers';
import type { MaterialRow } from './materials.repository.ts';

/** The engine's view of a stored material version (SI units). */
export function toCoreMaterial(row: MaterialRow): CoreMaterial {
  return {
    id: String(row.id),
    name: row.name,
    family: row.family,
    k: row.k,
    alpha: row.alpha,
    beta: row.beta,
    fitFrequencyMin: row.fitFrequencyMin,
    fitFrequencyMax: row.fitFrequencyMax,
    fitFluxMin: row.fitFluxMin,
    fitFluxMax: row.fitFluxMax,
    ...temperatureCorrection(row),
    bsat25: row.bsat25,
    bsat100: row.bsat100,
    permeability: row.permeability,
    ...(row.rollOffA != null && row.rollOffB != null && row.rollOffC != null
      ? { rollOff: { a: row.rollOffA, b: row.rollOffB, c: row.rollOffC } }
      : {}),
    density: row.density,
    ...(row.maxTemperature != null ? { maxTemperature: row.maxTemperature } : {}),
  };
}

/**
 * The stored coefficients as the engine uses them: with a t_ref, k is the loss at t_ref, so the factor is divided
 * by its value there (factor(t_ref) = 1); without one, k·factor(T) as stored.
 */
function temperatureCorrection(row: MaterialRow): Pick<CoreMaterial, 'tempCoefficients'> {
  if (row.ct0 == null || row.ct1 == null || row.ct2 == null) return {};
  const stored = { ct0: row.ct0, ct1: row.ct1, ct2: row.ct2 };
  return {
    tempCoefficients: row.referenceTemperature == null ? stored : referredTemperatureCoefficients(stored, row.referenceTemperature),
  };
}

/** What the API lists: the engine's fields plus version, provenance and state. */
export function toMaterialSummary(row: MaterialRow): MaterialSummary {
  return {
    ...toCoreMaterial(row),
    lineage: row.lineage,
    version: row.version,
    retired: row.retired,
    unitSet: row.unitSet,
    kUploaded: row.kUploaded,
    referenceTemperature: row.referenceTemperature,
    provenance: row.provenance,
    createdAt: row.createdAt.toISOString(),
  };
}
