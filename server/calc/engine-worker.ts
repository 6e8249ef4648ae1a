// Entry file of the engine's worker threads (piscina calls the default export once per task).
import { move, transferableSymbol, valueSymbol } from 'piscina';
import { runEngineTask, type EngineTask, type EngineTaskOutcome } from './engine-tasks.ts';

export default function runInWorker(task: EngineTask): EngineTaskOutcome {
  const outcome = runEngineTask(task);
  // An answer's bytes are handed over, not copied: copying ~200 KB cost the thread about as much as the engine did.
  if (outcome.ok && outcome.value instanceof Uint8Array) {
    return move({ [transferableSymbol]: [outcome.value.buffer], [valueSymbol]: outcome }) as unknown as EngineTaskOutcome;
  }
  return outcome;
}
