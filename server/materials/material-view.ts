import { referredTemperatureCoefficients } from '@shared/engine/core-loss';
import { rollOffToEngine } from '@shared/fitting/rolloff-fit';
import { behaviourToQuadratic, type TemperatureBehaviour } from '@shared/fitting/temperature-fit';
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
    ...(row.rollOffHalfField != null && row.rollOffSteepness != null
      ? { rollOff: rollOffToEngine({ halfField: row.rollOffHalfField, steepness: row.rollOffSteepness }) }
      : {}),
    ...(row.biasLossDoublingField != null && row.biasLossSteepness != null
      ? { biasLoss: { doublingField: row.biasLossDoublingField, steepness: row.biasLossSteepness } }
      : {}),
    density: row.density,
    ...(row.maxTemperature != null ? { maxTemperature: row.maxTemperature } : {}),
  };
}

/** The stored temperature behaviour, or null when the version has none. */
function temperatureBehaviour(row: MaterialRow): TemperatureBehaviour | null {
  const { lowestLossTemperature, lowestLossFactor, lossCurvature } = row;
  if (lowestLossTemperature == null || lowestLossFactor == null || lossCurvature == null) return null;
  return { lowestLossTemperature, lowestLossFactor, curvature: lossCurvature };
}

/**
 * The stored behaviour as the engine's quadratic: with a t_ref, k is the loss at t_ref, so the factor is divided
 * by its value there (factor(t_ref) = 1, F0 > 0 keeps it positive); without one, k·factor(T) as stored.
 */
function temperatureCorrection(row: MaterialRow): Pick<CoreMaterial, 'tempCoefficients'> {
  const behaviour = temperatureBehaviour(row);
  if (!behaviour) return {};
  const stored = behaviourToQuadratic(behaviour);
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
    temperatureBehaviour: temperatureBehaviour(row),
    rollOffCurve:
      row.rollOffHalfField != null && row.rollOffSteepness != null
        ? { halfField: row.rollOffHalfField, steepness: row.rollOffSteepness }
        : null,
    provenance: row.provenance,
    createdAt: row.createdAt.toISOString(),
  };
}
