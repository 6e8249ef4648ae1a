// What the library shows of a version beside its cells: how many loss points it carries, how well its own stored
// coefficients meet them, and its temperature of lowest loss. Read for every listed version in one query.
import { coreLossTemperatureFactor, steinmetzLoss, TEMPERATURE_FACTOR_FLOOR, type CoreMaterial } from '@shared/engine/index';
import { fitQuality } from '@shared/fitting/fit-quality';
import type { MaterialData } from '@shared/schemas/material-answers';
import type { LossPointsRepository, Measured } from '../loss-points/loss-points.repository.ts';
import { toCoreMaterial } from './material-view.ts';
import type { MaterialRow } from './materials.repository.ts';

/** The loss at a point as the engine computes it: Steinmetz at B̂ times the temperature factor, floored as in the engine. */
function engineLoss(material: CoreMaterial, point: Measured): number {
  const factor = coreLossTemperatureFactor(material.tempCoefficients, point.temperature);
  return steinmetzLoss(material, point.frequency, point.peakFlux) * Math.max(factor, TEMPERATURE_FACTOR_FLOOR);
}

/** Relative slack on the fitted ranges' ends, so a point on an end is inside whatever the rounding. */
const RANGE_SLACK = 1e-9;

/** Whether a point lies within the frequency and flux ranges the coefficients were fitted on. */
function inFittedRange(material: CoreMaterial, p: Measured): boolean {
  const within = (value: number, low: number, high: number) => value >= low * (1 - RANGE_SLACK) && value <= high * (1 + RANGE_SLACK);
  return (
    within(p.frequency, material.fitFrequencyMin, material.fitFrequencyMax) && within(p.peakFlux, material.fitFluxMin, material.fitFluxMax)
  );
}

/**
 * The stored coefficients against the version's own points within its fitted ranges (a band fitted on part of the
 * points is judged on that part: a fit never speaks for data outside its ranges); null when no point lies there.
 */
export function storedFitQuality(material: CoreMaterial, points: readonly Measured[]): MaterialData['fitQuality'] {
  const covered = points.filter((p) => inFittedRange(material, p));
  if (!covered.length) return null;
  const quality = fitQuality(
    covered.map((p) => engineLoss(material, p)),
    covered.map((p) => p.lossDensity),
  );
  return { rmsRelativeError: quality.rmsRelativeError, worstRelativeError: quality.worstRelativeError, pointCount: quality.pointCount };
}

/** The stored temperature of lowest loss (°C); null without a temperature behaviour or for a flat one (no lowest point). */
export function lowestLossTemperature(row: Pick<MaterialRow, 'lowestLossTemperature' | 'lossCurvature'>): number | null {
  return row.lowestLossTemperature != null && (row.lossCurvature ?? 0) > 0 ? row.lowestLossTemperature : null;
}

/** The library's figures of each row, by id: one query reads the points of every row (their count comes with them). */
export async function materialData(points: LossPointsRepository, rows: readonly MaterialRow[]): Promise<Map<number, MaterialData>> {
  const byVersion = await points.measuredOf(rows.map((r) => r.id));
  return new Map(
    rows.map((row) => {
      const material = toCoreMaterial(row);
      const own = byVersion.get(row.id) ?? [];
      return [
        row.id,
        { lossPointCount: own.length, fitQuality: storedFitQuality(material, own), lowestLossTemperature: lowestLossTemperature(row) },
      ];
    }),
  );
}
