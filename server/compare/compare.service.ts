import {
  coreLossTemperatureFactor,
  ENGINE_VERSION,
  fitRangeCheck,
  igseTriangleLoss,
  steinmetzLoss,
  TEMPERATURE_FACTOR_FLOOR,
  type ConverterSpec,
  type DesignLimits,
} from '@shared/engine/index';
import type { CoreMaterial, CoreShape, WireOption } from '@shared/engine/types';
import type {
  CompareCurvesRequest,
  CompareCurvesResponse,
  CompareDesignRequest,
  CompareDesignResponse,
  CompareSavedDesignRequest,
  CurvePoint,
} from '@shared/schemas/compare';
import type { WireChoice } from '@shared/catalogue/wire-from-request';
import type { Construction, DesignSpec } from '@shared/schemas/designs';
import type { SearchPool } from '../calc/search-pool.ts';
import { badRequest, conflict } from '../http/errors.ts';
import { toCoreMaterial } from '../materials/material-view.ts';
import type { MaterialRow, MaterialsRepository } from '../materials/materials.repository.ts';

/** Logarithmically spaced points from min to max inclusive. */
export function logSpace(min: number, max: number, points: number): number[] {
  const ratio = Math.log(max / min) / (points - 1);
  return Array.from({ length: points }, (_, i) => (i === points - 1 ? max : min * Math.exp(ratio * i)));
}

/** The material's temperature factor at `temperature` as the engine applies it (floored); 1 without a temperature. */
function temperatureFactor(material: CoreMaterial, temperature: number | undefined): number {
  if (temperature === undefined) return 1;
  return Math.max(coreLossTemperatureFactor(material.tempCoefficients, temperature), TEMPERATURE_FACTOR_FLOOR);
}

function lossPoint(material: CoreMaterial, x: number, frequency: number, deltaB: number, duty: number, factor: number): CurvePoint {
  const peak = deltaB / 2;
  const fit = fitRangeCheck(material, frequency, peak);
  return {
    x,
    steinmetz: steinmetzLoss(material, frequency, peak) * factor,
    igse: igseTriangleLoss(material, frequency, deltaB, duty) * factor,
    extrapolated: !fit.frequencyInRange || !fit.fluxInRange,
  };
}

/** Where the comparison finds cores and wires (shipped catalogue plus user cores). */
export interface CompareCatalogue {
  core(id: string): Promise<CoreShape>;
  wire(choice: WireChoice): WireOption;
}

/** A saved revision as the designs service returns it (only what the comparison reads). */
export interface SavedRevision {
  revision: number;
  spec: DesignSpec;
  construction: Construction | null;
  design: { id: number; number: string; title: string };
}
export interface SavedRevisions {
  revision(designId: number, revision: number): Promise<SavedRevision>;
}

export class CompareService {
  constructor(
    private readonly materials: MaterialsRepository,
    private readonly catalogue: CompareCatalogue,
    private readonly revisions: SavedRevisions,
    private readonly engine: Pick<SearchPool, 'compareMaterials'>,
  ) {}

  private async rows(ids: string[]): Promise<MaterialRow[]> {
    const numeric = ids.map(Number);
    const rows = await this.materials.findByIds(numeric);
    const byId = new Map(rows.map((r) => [r.id, r]));
    return numeric.map((id, i) => {
      const row = byId.get(id);
      if (!row) throw badRequest(`No material with id ${id}.`, { [`materialIds.${i}`]: `Unknown material ${id}` });
      return row;
    });
  }

  async curves(request: CompareCurvesRequest): Promise<CompareCurvesResponse> {
    const rows = await this.rows(request.materialIds);
    const frequencies = logSpace(request.frequencyRange.min, request.frequencyRange.max, request.points);
    const swings = logSpace(request.fluxRange.min, request.fluxRange.max, request.points);
    return {
      deltaB: request.deltaB,
      frequency: request.frequency,
      duty: request.duty,
      temperature: request.temperature ?? null,
      materials: rows.map((row) => {
        const material = toCoreMaterial(row);
        const factor = temperatureFactor(material, request.temperature);
        return {
          id: material.id,
          name: material.name,
          family: material.family,
          version: row.version,
          fit: { frequencyMin: row.fitFrequencyMin, frequencyMax: row.fitFrequencyMax, fluxMin: row.fitFluxMin, fluxMax: row.fitFluxMax },
          versusFrequency: frequencies.map((f) => lossPoint(material, f, f, request.deltaB, request.duty, factor)),
          versusFlux: swings.map((swing) => lossPoint(material, swing, request.frequency, swing, request.duty, factor)),
        };
      }),
    };
  }

  /**
   * A saved revision's core, turns and wire with each material. The revision's own material version is always
   * among the rows (even when it has since been edited or retired), so the table shows what the design gives up or gains.
   */
  async savedDesign(request: CompareSavedDesignRequest): Promise<CompareDesignResponse> {
    const saved = await this.revisions.revision(request.designId, request.revision);
    const construction = saved.construction;
    const label = `${saved.design.number} revision ${saved.revision}`;
    if (!construction) {
      throw conflict(`${label} has no construction yet: pick a core, material and wire on the design page first.`, {
        revision: 'No construction to compare',
      });
    }
    if (construction.turns === 'auto') {
      throw conflict(`${label} has no resolved turn count; open it and save it once so the engine fixes the turns.`, {
        revision: 'Turns not resolved',
      });
    }
    const own = construction.materialId;
    const listed = request.materialIds?.length ? await this.rows(request.materialIds) : await this.materials.listCurrent();
    const rows = listed.some((r) => String(r.id) === own) ? listed : [...listed, ...(await this.rows([own]))];
    const result = await this.compareRows(
      {
        spec: saved.spec.converter,
        limits: saved.spec.limits,
        coreId: construction.coreId,
        turns: construction.turns,
        wire: construction.wire,
        placement: construction.placement,
      },
      rows,
    );
    return {
      ...result,
      design: { id: saved.design.id, number: saved.design.number, title: saved.design.title, revision: saved.revision, materialId: own },
      rows: result.rows.map((row) => (row.materialId === own ? { ...row, usedByDesign: true } : row)),
    };
  }

  /** Same core, turns and wire with each material; the gap is solved again for each material's permeability. */
  async design(request: CompareDesignRequest): Promise<CompareDesignResponse> {
    const rows = request.materialIds?.length ? await this.rows(request.materialIds) : await this.materials.listCurrent();
    return this.compareRows(request, rows);
  }

  private async compareRows(request: Omit<CompareDesignRequest, 'materialIds'>, rows: MaterialRow[]): Promise<CompareDesignResponse> {
    const core = await this.catalogue.core(request.coreId);
    let wire: WireOption;
    try {
      wire = this.catalogue.wire(request.wire);
    } catch (error) {
      throw badRequest((error as Error).message, { wire: (error as Error).message });
    }
    // In a worker thread: every material is a full evaluation, too long a loop for the main thread.
    const { rows: result, fluxPoint } = await this.engine.compareMaterials({
      spec: request.spec as ConverterSpec,
      limits: request.limits as Partial<DesignLimits> | undefined,
      core,
      turns: request.turns,
      wire,
      placement: request.placement,
      materials: rows.map(toCoreMaterial),
    });
    return {
      engineVersion: ENGINE_VERSION,
      coreId: core.id,
      turns: request.turns,
      placement: request.placement ?? 'ground',
      ...(fluxPoint ? { fluxPoint } : {}),
      rows: result,
    };
  }
}
