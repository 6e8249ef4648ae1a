import { EngineInputError } from '@shared/engine/index';
import type { RollOffFit } from '@shared/engine/types';
import { converterSpecSchema } from '@shared/schemas/calc';
import { readStoredResult } from '@shared/schemas/designs';
import type { Logger } from 'pino';
import type { JobRun } from '../jobs/job-queue.ts';
import type { MaterialsRepository } from '../materials/materials.repository.ts';
import { toCoreMaterial } from '../materials/material-view.ts';
import { SolverError } from '../solvers/solver-run.ts';
import type { CheckJobData } from './check-jobs.ts';
import type { ChecksRepository } from './checks.repository.ts';
import { runCircuitCheck, type CircuitCheckInput, type CircuitCheckRun } from './circuit-check.ts';

/** A check that cannot succeed however often it is tried: reported at once, in plain words. */
class CheckRefused extends Error {}
/** The check was cancelled while it ran: stop and store nothing. */
class CheckCancelled extends Error {}

export interface CheckHandlerDeps {
  repo: ChecksRepository;
  materials: Pick<MaterialsRepository, 'findByIds'>;
  logger: Logger;
  /** The circuit check itself (tests may wrap it, e.g. to fail an attempt as a killed worker would). */
  circuit?: (input: CircuitCheckInput, run: CircuitCheckRun) => Promise<unknown>;
}

/**
 * Works one check job: marks the check running (a retried job starts over), runs it with progress, and stores the
 * result with 'done' in one statement — unless the check was cancelled meanwhile, when the result is discarded.
 * A failure that no retry can mend is stored at once; any other is thrown so the queue retries the job, and is
 * stored only when no retry is left.
 */
export function createCheckHandler(deps: CheckHandlerDeps) {
  const circuit = deps.circuit ?? runCircuitCheck;
  return async ({ data, attempt, lastAttempt }: JobRun<CheckJobData>): Promise<void> => {
    const { repo, logger } = deps;
    const check = await repo.markRunning(data.checkId);
    if (!check) return; // cancelled (or gone) before it started
    try {
      const input = await circuitInput(deps, check.revisionId);
      const onProgress = async (progress: number) => {
        if (!(await repo.setProgress(check.id, progress))) throw new CheckCancelled();
      };
      const result = await circuit(input, { onProgress });
      if (!(await repo.finish(check.id, result))) logger.info({ checkId: check.id }, 'check cancelled while running: result discarded');
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
  if (err instanceof SolverError) return `The circuit simulator failed: ${err.message}`;
  if (err instanceof EngineInputError) return `The design cannot be simulated at this corner: ${err.message}`;
  return undefined;
}

async function circuitInput(deps: CheckHandlerDeps, revisionId: number): Promise<CircuitCheckInput> {
  const revision = await deps.repo.revisionOf(revisionId);
  if (!revision) throw new CheckRefused('The revision no longer exists.');
  const { result, resultUnreadable } = readStoredResult(revision.result);
  if (resultUnreadable) throw new CheckRefused(`The revision’s saved figures no longer read (${resultUnreadable}).`);
  if (!result) throw new CheckRefused('The revision has no chosen construction yet; pick a candidate first.');
  const spec = converterSpecSchema.safeParse((revision.spec as { converter?: unknown } | null)?.converter);
  if (!spec.success) throw new CheckRefused('The revision’s converter spec no longer reads; save it again.');
  return { spec: spec.data, evaluation: result.evaluation, rollOff: await rollOffOf(deps, revision.materialId) };
}

/** The stored material's roll-off (powder); none for a material that is gone or has none. */
async function rollOffOf(deps: CheckHandlerDeps, materialId: number | null): Promise<RollOffFit | undefined> {
  if (materialId === null) return undefined;
  const [row] = await deps.materials.findByIds([materialId]);
  return row ? toCoreMaterial(row).rollOff : undefined;
}
