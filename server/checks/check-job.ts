import { EngineInputError } from '@shared/engine/index';
import type { CoreShape, RollOffFit } from '@shared/engine/types';
import { converterSpecSchema } from '@shared/schemas/calc';
import { readStoredResult, wireRequestOf } from '@shared/schemas/designs';
import type { Logger } from 'pino';
import type { JobRun } from '../jobs/job-queue.ts';
import type { MaterialsRepository } from '../materials/materials.repository.ts';
import { toCoreMaterial } from '../materials/material-view.ts';
import type { CatalogueService } from '../catalogue/catalogue.service.ts';
import { FieldGeometryError } from '../solvers/field/design-model.ts';
import { SolverError } from '../solvers/solver-run.ts';
import type { CheckJobData } from './check-jobs.ts';
import type { ChecksRepository } from './checks.repository.ts';
import { runCircuitCheck, type CircuitCheckInput, type CircuitCheckRun } from './circuit-check.ts';
import { runFieldCheck, type FieldCheckInput, type FieldCheckRun } from './field-check.ts';

/** A check that cannot succeed however often it is tried: reported at once, in plain words. */
class CheckRefused extends Error {}
/** The check was cancelled while it ran: stop and store nothing. */
class CheckCancelled extends Error {}

export interface CheckHandlerDeps {
  repo: ChecksRepository;
  materials: Pick<MaterialsRepository, 'findByIds'>;
  /** The cores (shipped and user cores) and wires the field model is built from. */
  cores: { core: (id: string) => Promise<CoreShape>; wire: CatalogueService['wire'] };
  logger: Logger;
  /** The circuit check itself (tests may wrap it, e.g. to fail an attempt as a killed worker would). */
  circuit?: (input: CircuitCheckInput, run: CircuitCheckRun) => Promise<unknown>;
  field?: (input: FieldCheckInput, run: FieldCheckRun) => Promise<unknown>;
}

/**
 * Works one check job: marks the check running (a retried job starts over), runs it with progress, and stores the
 * result with 'done' in one statement — unless the check was cancelled meanwhile, when the result is discarded.
 * A failure that no retry can mend is stored at once; any other is thrown so the queue retries the job, and is
 * stored only when no retry is left.
 */
export function createCheckHandler(deps: CheckHandlerDeps) {
  const circuit = deps.circuit ?? runCircuitCheck;
  const field = deps.field ?? runFieldCheck;
  return async ({ data, attempt, lastAttempt }: JobRun<CheckJobData>): Promise<void> => {
    const { repo, logger } = deps;
    const check = await repo.markRunning(data.checkId);
    if (!check) return; // cancelled (or gone) before it started
    try {
      const onProgress = async (progress: number) => {
        if (!(await repo.setProgress(check.id, progress))) throw new CheckCancelled();
      };
      const result =
        check.kind === 'field'
          ? await field(await fieldInput(deps, check.revisionId), { onProgress })
          : await circuit(await circuitInput(deps, check.revisionId), { onProgress });
      const outcome = await repo.finish(check.id, result);
      if (outcome !== 'stored') logger.info({ checkId: check.id, outcome }, 'check result discarded');
    } catch (err) {
      if (err instanceof CheckCancelled) return;
      const plain = plainReason(err);
      if (plain !== undefined) return repo.fail(check.id, plain);
      logger.warn({ checkId: check.id, attempt, err: err instanceof Error ? err.message : String(err) }, 'check attempt failed');
      if (!lastAttempt) throw err;
      await repo.fail(check.id, `The check stopped ${attempt} times without finishing; the last time: ${messageOf(err)}`);
    }
  };
}

const messageOf = (err: unknown) => (err instanceof Error ? err.message : String(err));

function plainReason(err: unknown): string | undefined {
  if (err instanceof CheckRefused) return err.message;
  if (err instanceof SolverError) return `The solver failed: ${err.message}`;
  if (err instanceof FieldGeometryError) return `The field model cannot be built (${err.field}): ${err.message}`;
  if (err instanceof EngineInputError) return `The design cannot be simulated at this corner: ${err.message}`;
  return undefined;
}

/** The revision's stored evaluation, or a plain refusal. */
async function storedEvaluation(deps: CheckHandlerDeps, revisionId: number) {
  const revision = await deps.repo.revisionOf(revisionId);
  if (!revision) throw new CheckRefused('The revision no longer exists.');
  const { result, resultUnreadable } = readStoredResult(revision.result);
  if (resultUnreadable) throw new CheckRefused(`The revision’s saved figures no longer read (${resultUnreadable}).`);
  if (!result) throw new CheckRefused('The revision has no chosen construction yet; pick a candidate first.');
  return { revision, evaluation: result.evaluation };
}

async function fieldInput(deps: CheckHandlerDeps, revisionId: number): Promise<FieldCheckInput> {
  const { revision, evaluation } = await storedEvaluation(deps, revisionId);
  let core;
  try {
    core = await deps.cores.core(evaluation.core.id);
  } catch {
    throw new CheckRefused(`The core ${evaluation.core.id} is neither a shipped core nor a current user core.`);
  }
  const [material] = revision.materialId === null ? [] : await deps.materials.findByIds([revision.materialId]);
  if (!material) throw new CheckRefused('The revision’s material version is gone; the field model needs its permeability.');
  return {
    evaluation,
    core,
    wire: deps.cores.wire(wireRequestOf(evaluation.wire)),
    permeability: toCoreMaterial(material).permeability,
    title: `${evaluation.core.id}, ${evaluation.turns} turns, ${evaluation.gap.placement} gap`,
  };
}

async function circuitInput(deps: CheckHandlerDeps, revisionId: number): Promise<CircuitCheckInput> {
  const { revision, evaluation } = await storedEvaluation(deps, revisionId);
  const spec = converterSpecSchema.safeParse((revision.spec as { converter?: unknown } | null)?.converter);
  if (!spec.success) throw new CheckRefused('The revision’s converter spec no longer reads; save it again.');
  return { spec: spec.data, evaluation, rollOff: await rollOffOf(deps, revision.materialId) };
}

/** The stored material's roll-off (powder); none for a material that is gone or has none. */
async function rollOffOf(deps: CheckHandlerDeps, materialId: number | null): Promise<RollOffFit | undefined> {
  if (materialId === null) return undefined;
  const [row] = await deps.materials.findByIds([materialId]);
  return row ? toCoreMaterial(row).rollOff : undefined;
}
