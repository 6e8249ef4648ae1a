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

/** The stored coefficients against the version's own points; null without points. */
export function storedFitQuality(material: CoreMaterial, points: readonly Measured[]): MaterialData['fitQuality'] {
  if (!points.length) return null;
  const quality = fitQuality(
    points.map((p) => engineLoss(material, p)),
    points.map((p) => p.lossDensity),
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
