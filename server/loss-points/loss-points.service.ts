import { EngineInputError } from '@shared/engine/index';
import type { LossPoint } from '@shared/fitting/loss-points';
import type { Role } from '@shared/schemas/auth';
import { kFromSi } from '@shared/schemas/material-csv';
import { materialCellsFromValues, validateMaterialCells, type MaterialValues } from '@shared/schemas/material-values';
import type { FitAccept, FitOptions } from '@shared/schemas/loss-points';
import type { Actor } from '../http/access.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { badRequest, notFound } from '../http/errors.ts';
import type { SearchPool } from '../calc/search-pool.ts';
import { recordActions } from '../library/record-actions.ts';
import type { MaterialRow } from '../materials/materials.repository.ts';
import { valuesOf, type MaterialsService } from '../materials/materials.service.ts';
import { lossPointFileErrors, lossPointTemplate, readLossPointFile } from './loss-point-csv.ts';
import type { LossPointsRepository } from './loss-points.repository.ts';
import type { MaterialFit } from './material-fit.ts';

/** Where fits run: the engine's worker threads (server/calc/search-pool.ts), off the main thread. */
export type FitRunner = Pick<SearchPool, 'fitMaterial'>;

/** The fit, a refusal of it as a 400 naming the field (and the point). */
async function runFit(runner: FitRunner, points: LossPoint[], options: FitOptions): Promise<MaterialFit> {
  try {
    return await runner.fitMaterial({ points, options });
  } catch (error) {
    if (error instanceof EngineInputError) throw badRequest(error.message, { [error.field]: error.message });
    throw error;
  }
}

/**
 * Loss points of material versions and the fits made from them. Points are replaced by uploading a file, which makes
 * a new version of the material carrying them (the earlier version keeps its own); accepting a fit makes a new version
 * with the fitted coefficients and the same points. Both go through the materials' versioned library.
 */
export class LossPointsService {
  constructor(
    private readonly materials: MaterialsService,
    private readonly points: LossPointsRepository,
    private readonly runner: FitRunner,
  ) {}

  private async version(id: number): Promise<MaterialRow> {
    const row = await this.materials.library.store.findById(id);
    if (!row) throw notFound(`No material with id ${id}.`);
    return row;
  }

  async list(id: number, role: Role) {
    const row = await this.version(id);
    return {
      materialId: row.id,
      name: row.name,
      version: row.version,
      current: row.current,
      canEdit: recordActions(role, row).canEdit,
      points: await this.points.list(id),
    };
  }

  template(): string {
    return lossPointTemplate();
  }

  async preview(id: number, file: UploadedFile) {
    await this.version(id);
    return readLossPointFile(file).preview;
  }

  /** Every point of the file or none, on a new version of the current version `id`. */
  async commit(id: number, file: UploadedFile, actor: Actor) {
    const { preview, points } = readLossPointFile(file);
    const refusal = lossPointFileErrors(preview);
    if (refusal) throw refusal;
    const inserted = await this.materials.library.newVersion(id, actor, valuesOf, {
      action: 'material.loss-points-imported',
      within: async (tx, row) => {
        await this.points.insert(tx, row.id, points);
        return { fileName: preview.fileName, points: points.length };
      },
    });
    return { materialId: inserted.id, version: inserted.version, pointCount: points.length };
  }

  async fit(id: number, options: FitOptions) {
    await this.version(id);
    return { materialId: id, ...(await runFit(this.runner, await this.points.list(id), options)) };
  }

  /**
   * The fit made again from the stored points (never coefficients sent by the client) as a new version: k, α, β and
   * the fitted ranges of the chosen band, exactly its points' ranges; the temperature behaviour referred to its
   * lowest-loss temperature (t_ref = T0, factor 1 there), or without it t_ref at the points' temperature and the
   * stored behaviour kept. The new version keeps a copy of the points.
   */
  async accept(id: number, body: FitAccept, actor: Actor) {
    const { band: chosen, ...options } = body;
    await this.version(id);
    const points = await this.points.list(id);
    const fit = await runFit(this.runner, points, options);
    if (chosen === undefined && fit.fits.length > 1) {
      throw badRequest(`The fit has ${fit.fits.length} bands: choose the one to keep.`, {
        band: `Choose a band from 0 to ${fit.fits.length - 1}`,
      });
    }
    const band = chosen ?? 0;
    if (band >= fit.fits.length) {
      throw badRequest(`The fit has ${fit.fits.length} band(s); there is no band ${band}.`, { band: `At most ${fit.fits.length - 1}` });
    }
    // Without a temperature fit the points are at one temperature, where the fitted k holds.
    const pointsAt = options.temperature ? undefined : points[fit.residuals[0]!.index]!.temperature;
    const inserted = await this.materials.library.newVersion(id, actor, (row) => fittedValues(row, fit, band, fit.pointCount, pointsAt), {
      action: 'material.fit-accepted',
      within: async (tx, row, previous) => {
        await this.points.copy(tx, previous.id, row.id);
        const steinmetz = fit.fits[band]!;
        return {
          from: previous.id,
          points: fit.pointCount,
          band,
          rmsRelativeError: steinmetz.rmsRelativeError,
          worstRelativeError: steinmetz.worstRelativeError,
        };
      },
    });
    const [material] = await this.materials.details([{ ...inserted, createdByName: actor.displayName }], actor.role);
    return {
      material: material!,
      fit: { materialId: id, ...fit },
      band,
    };
  }
}

/** A stored version's values with the fit's coefficients and ranges; checked as an edit would be. */
export function fittedValues(
  row: MaterialRow,
  fit: MaterialFit,
  band: number,
  pointCount: number,
  pointsAt: number | undefined,
): MaterialValues {
  const steinmetz = fit.fits[band]!;
  const temperature = fit.temperature;
  const values: MaterialValues = {
    ...valuesOf(row),
    k: steinmetz.k,
    kUploaded: kFromSi(steinmetz.k, row.unitSet, steinmetz.alpha, steinmetz.beta),
    alpha: steinmetz.alpha,
    beta: steinmetz.beta,
    fitFrequencyMin: steinmetz.fittedFrequency[0],
    fitFrequencyMax: steinmetz.fittedFrequency[1],
    fitFluxMin: steinmetz.fittedFlux[0],
    fitFluxMax: steinmetz.fittedFlux[1],
    ...(temperature
      ? {
          lowestLossTemperature: temperature.lowestLossTemperature,
          lowestLossFactor: temperature.lowestLossFactor,
          lossCurvature: temperature.curvature,
          referenceTemperature: temperature.lowestLossTemperature,
        }
      : { referenceTemperature: pointsAt ?? row.referenceTemperature }),
    ...(fit.biasLoss ? { biasLossDoublingField: fit.biasLoss.doublingField, biasLossSteepness: fit.biasLoss.steepness } : {}),
    provenance: `${row.provenance.slice(0, 380)}; k, α, β fitted from ${pointCount} loss points${
      fit.biasLoss ? `, DC-bias loss from ${fit.biasLoss.pointCount} under bias` : ''
    }`.slice(0, 500),
  };
  const { problems } = validateMaterialCells(materialCellsFromValues(values));
  if (problems.length) {
    throw badRequest(
      `The fitted coefficients cannot be stored: ${problems
        .map((p) => p.message)
        .slice(0, 3)
        .join('; ')}`,
      Object.fromEntries(problems.map((p) => [p.column, p.message])),
    );
  }
  return values;
}
