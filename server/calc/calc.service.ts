import {
  ENGINE_VERSION,
  EngineInputError,
  evaluateDesign,
  gapLossByWindowImages,
  igsePiecewiseLinearLoss,
  igseTriangleLoss,
  lossMap,
  lossVersusFrequency,
  operatingPoint,
  rippleHarmonics,
  steinmetzLoss,
  type SearchInput,
} from '@shared/engine/index';
import type { CoreMaterial } from '@shared/engine/types';
import { rollOffToEngine } from '@shared/fitting/rolloff-fit';
import { behaviourToQuadratic } from '@shared/fitting/temperature-fit';
import type { CoreLossRequest, EvaluateRequest, InlineMaterial, OperatingPointRequest, SearchRequest } from '@shared/schemas/calc';
import type { EvaluateSweep } from '@shared/schemas/calc-answers';
import type { CatalogueService } from '../catalogue/catalogue.service.ts';
import { badRequest } from '../http/errors.ts';
import { toCoreMaterial } from '../materials/material-view.ts';
import type { MaterialsRepository } from '../materials/materials.repository.ts';
import type { SearchPool } from './search-pool.ts';

const HARMONICS_REPORTED = 15;
/** The gap-field loss's share of the total from which evaluate adds the image method's cross-check. */
const GAP_CROSS_CHECK_SHARE = 0.02;
const SINE_SAMPLES = 720;
// Used only for mass figures when an inline material gives no density (common practice, no source).
const TYPICAL_DENSITY: Record<InlineMaterial['family'], number> = {
  ferrite: 4800,
  powder: 6500,
  amorphous: 7200,
  nanocrystalline: 7300,
  other: 5000,
};

/** Engine refusals become 400s that name the offending field. */
function asBadRequest(error: unknown, fieldPrefix = ''): unknown {
  return error instanceof EngineInputError ? badRequest(error.message, { [`${fieldPrefix}${error.field}`]: error.message }) : error;
}

function engineCall<T>(fn: () => T, fieldPrefix = ''): T {
  try {
    return fn();
  } catch (error) {
    throw asBadRequest(error, fieldPrefix);
  }
}

export class CalcService {
  constructor(
    private readonly catalogue: CatalogueService,
    private readonly materials: MaterialsRepository,
    private readonly pool: SearchPool,
  ) {}

  operatingPoint(request: OperatingPointRequest) {
    const { inductanceTolerance, ...spec } = request;
    const op = engineCall(() => operatingPoint(spec, inductanceTolerance ?? 0.1));
    const amplitudes = rippleHarmonics(op.rippleAtVinMax, op.dutyAtVinMax, HARMONICS_REPORTED);
    // The engine's names end to end: the answer schema is tied to OperatingPoint.
    return { engineVersion: ENGINE_VERSION, ...op, harmonics: Array.from(amplitudes, (amplitude, i) => ({ n: i + 1, amplitude })) };
  }

  coreLoss({ material, frequency, deltaB, duty, waveform }: CoreLossRequest) {
    const steinmetz = steinmetzLoss(material, frequency, deltaB / 2);
    let igse: number;
    if (waveform === 'triangle') {
      igse = igseTriangleLoss(material, frequency, deltaB, duty);
    } else {
      // Through the general iGSE, not by assumption: a sampled sinusoid of the same peak.
      const times = new Float64Array(SINE_SAMPLES + 1);
      const flux = new Float64Array(SINE_SAMPLES + 1);
      for (let i = 0; i <= SINE_SAMPLES; i++) {
        times[i] = i / SINE_SAMPLES / frequency;
        flux[i] = (deltaB / 2) * Math.sin((2 * Math.PI * i) / SINE_SAMPLES);
      }
      igse = igsePiecewiseLinearLoss(material, times, flux);
    }
    return { steinmetz, igse };
  }

  async search(request: SearchRequest) {
    const input = await this.searchInput(request);
    const result = await this.pool.search(input).catch((error: unknown) => {
      throw asBadRequest(error, 'spec.');
    });
    return { engineVersion: ENGINE_VERSION, ...result };
  }

  /** The same answer as `search`, already encoded as JSON (and gzipped if asked) by the worker that ran it. */
  async searchAnswer(request: SearchRequest, options: { gzip: boolean }): Promise<Uint8Array> {
    const input = await this.searchInput(request);
    return this.pool.searchAnswer(input, options).catch((error: unknown) => {
      throw asBadRequest(error, 'spec.');
    });
  }

  private async searchInput(request: SearchRequest): Promise<SearchInput> {
    const materials = await this.resolveMaterials(request.materialIds ?? [], request.materials ?? []);
    let cores = this.catalogue.cores();
    if (request.coreIds?.length) {
      const wanted = new Set(request.coreIds);
      cores = cores.filter((c) => wanted.has(c.id));
    }
    const families = request.families ?? request.limits?.allowedFamilies;
    if (families?.length) cores = cores.filter((c) => families.includes(c.family));
    if (!cores.length) throw badRequest('No catalogue core matches the requested ids and families.', { coreIds: 'No matching core' });
    return {
      spec: request.spec,
      limits: request.limits,
      cores,
      materials,
      wires: this.catalogue.standardWires(),
      rankBy: request.rankBy,
      offset: request.offset,
      limit: request.limit,
    };
  }

  async evaluate(request: EvaluateRequest, options: { sweep?: EvaluateSweep } = {}) {
    const core = this.catalogue.core(request.coreId);
    const [material] = request.material
      ? await this.resolveMaterials([], [request.material])
      : await this.resolveMaterials([request.materialId!], [], 'materialId');
    const wire = this.catalogue.wire(request.wire);
    const input = {
      spec: request.spec,
      limits: request.limits,
      core,
      material,
      turns: request.turns,
      gap: request.gap,
      placement: request.placement,
      keepOut: request.keepOut,
      wire,
    };
    const result = engineCall(() => evaluateDesign(input), 'spec.');
    const sweep =
      options.sweep === 'frequency' || options.sweep === 'all'
        ? lossVersusFrequency(input, frequencySweepAround(request.spec.frequency), result)
        : undefined;
    const map =
      options.sweep === 'load' || options.sweep === 'all' ? engineCall(() => lossMap(input, undefined, result), 'spec.') : undefined;
    // Up to a few tens of milliseconds on this thread: only for the design page (which asks for a sweep) and only where
    // the term is worth a second opinion.
    const imageCheck =
      options.sweep !== undefined && (result.copper.gapLoss ?? 0) >= GAP_CROSS_CHECK_SHARE * result.totalLoss
        ? gapLossByWindowImages(input, result)
        : undefined;
    return {
      engineVersion: ENGINE_VERSION,
      wire,
      result,
      ...(sweep ? { lossVersusFrequency: sweep } : {}),
      ...(map ? { lossMap: map } : {}),
      ...(imageCheck !== undefined ? { gapLossByWindowImages: imageCheck } : {}),
    };
  }

  /** Stored materials by id (string ids as the API carries them) plus inline ones, in the engine's form. */
  private async resolveMaterials(ids: string[], inline: InlineMaterial[], field = 'materialIds'): Promise<CoreMaterial[]> {
    const numeric = ids.map((raw, i) => {
      const id = Number(raw);
      if (!Number.isInteger(id) || id < 1)
        throw badRequest(`Material id "${raw}" is not valid.`, {
          [ids.length > 1 || field === 'materialIds' ? `${field}.${i}` : field]: 'Not a material id',
        });
      return id;
    });
    const rows = await this.materials.findByIds(numeric);
    const byId = new Map(rows.map((r) => [r.id, r]));
    numeric.forEach((id, i) => {
      if (!byId.has(id)) {
        const key = field === 'materialIds' ? `${field}.${i}` : field;
        throw badRequest(`No material with id ${id}.`, { [key]: `Unknown material ${id}` });
      }
    });
    const stored = numeric.map((id) => toCoreMaterial(byId.get(id)!));
    const given = inline.map(({ temperatureBehaviour, rollOffCurve, ...m }, i) => ({
      ...m,
      id: m.id ?? `inline-${i + 1}`,
      density: m.density ?? TYPICAL_DENSITY[m.family],
      // Our own terms become the engine's constants, as for a stored material (material-view.ts).
      ...(temperatureBehaviour ? { tempCoefficients: behaviourToQuadratic(temperatureBehaviour) } : {}),
      ...(rollOffCurve ? { rollOff: rollOffToEngine(rollOffCurve) } : {}),
    }));
    return [...stored, ...given];
  }
}

/** Twelve frequencies from a quarter to four times the switching frequency, evenly spaced on a log scale. */
export function frequencySweepAround(frequency: number): number[] {
  const points = 12;
  return Array.from({ length: points }, (_, i) => frequency * 0.25 * 16 ** (i / (points - 1)));
}
