import { gzipSync } from 'node:zlib';
import { ENGINE_VERSION, EngineInputError, searchCandidates, type SearchInput, type SearchResult } from '@shared/engine/index';
import type { AnswerInputOf } from '@shared/api/endpoint';
import type { search } from '@shared/api/calc';
import { FitInputError } from '@shared/fitting/fit-error';
import { fitErrorField, fitMaterial, type MaterialFit, type MaterialFitInput } from '../loss-points/material-fit.ts';
import { compareAcrossMaterials, type MaterialComparison, type MaterialComparisonInput } from './material-comparison.ts';

// The engine calls long enough to stall the event loop, as plain data in and out: the same function runs inline
// (SEARCH_WORKERS=0) and inside a worker thread, where its answer crosses back by structured clone.
export type EngineTask =
  | { kind: 'search'; input: SearchInput }
  | { kind: 'search-answer'; input: SearchInput; gzip: boolean }
  | { kind: 'compare'; input: MaterialComparisonInput }
  | { kind: 'fit'; input: MaterialFitInput };

export interface EngineTaskResults {
  search: SearchResult;
  /**
   * The search route's answer as UTF-8 JSON, gzipped when the client takes it. Rebuilding ~200 KB of objects from
   * the clone, then encoding them, cost the main thread several times what the engine did; bytes go to the socket as
   * they come, and gzip (level 1: under 1 ms here for 190 KB → 27 KB) also spares the main thread most of the write.
   */
  'search-answer': Uint8Array;
  compare: MaterialComparison;
  fit: MaterialFit;
}

/** A refusal travels as data: an error's class and its `field` do not survive the trip back from a worker. */
export type EngineTaskOutcome<K extends EngineTask['kind'] = EngineTask['kind']> =
  { ok: true; value: EngineTaskResults[K] } | { ok: false; field: string; message: string };

function perform(task: EngineTask): EngineTaskResults[EngineTask['kind']] {
  switch (task.kind) {
    case 'search':
      return searchCandidates(task.input);
    case 'search-answer': {
      const answer = { engineVersion: ENGINE_VERSION, ...searchCandidates(task.input) } satisfies AnswerInputOf<typeof search>;
      const json = new TextEncoder().encode(JSON.stringify(answer));
      // Always a fresh buffer of its own, so the worker can hand it over whole (engine-worker.ts): gzip's output
      // may be a slice of a shared one.
      return task.gzip ? new Uint8Array(gzipSync(json, { level: 1 })) : json;
    }
    case 'compare':
      return compareAcrossMaterials(task.input);
    case 'fit':
      return fitMaterial(task.input.points, task.input.options);
  }
}

export function runEngineTask(task: EngineTask): EngineTaskOutcome {
  try {
    return { ok: true, value: perform(task) };
  } catch (error) {
    if (error instanceof EngineInputError) return { ok: false, field: error.field, message: error.message };
    if (error instanceof FitInputError) return { ok: false, field: fitErrorField(error), message: error.message };
    throw error;
  }
}
