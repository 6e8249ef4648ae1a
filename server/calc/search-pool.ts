import { Piscina } from 'piscina';
import { EngineInputError, type SearchInput, type SearchResult } from '@shared/engine/index';
import { AppError } from '../http/errors.ts';
import { runEngineTask, type EngineTask, type EngineTaskOutcome, type EngineTaskResults } from './engine-tasks.ts';
import type { MaterialFit, MaterialFitInput } from '../loss-points/material-fit.ts';
import type { MaterialComparison, MaterialComparisonInput } from './material-comparison.ts';

export interface SearchPoolOptions {
  /** Worker threads; 0 runs every task inline on the calling (main) thread. */
  workers: number;
  /** Tasks allowed to wait while every thread is busy; one more is refused with a 503. */
  queue: number;
  /** A thread beyond the first, idle this long, is ended (the next busy spell starts it again). */
  idleMs: number;
  /**
   * Added to the threads' nice value (Linux; 0 leaves it): when the machine's cores are all busy, the main thread
   * answering other requests, and the database serving them, go before a search.
   */
  nice: number;
}

/** Registers tsx's module hooks itself, then loads engine-worker.ts as ES modules (why: in the file). */
const WORKER_ENTRY = new URL('./engine-worker-entry.mjs', import.meta.url).href;

export const searchBusy = () => new AppError(503, 'busy', 'The server is busy with other searches. Try again in a moment.');

/**
 * Runs the engine's long calls (a candidate search, a design across every material) in a pool of worker threads,
 * so the main thread keeps answering other requests while they run. The first thread starts on first use (or on
 * `warm()`) and stays: starting one costs about a second (tsx and the engine load in each thread). Extra threads
 * start when tasks wait and end when idle.
 */
export class SearchPool {
  private piscina?: Piscina<EngineTask, EngineTaskOutcome>;
  private inFlight = 0;
  private closing?: Promise<void>;

  constructor(private readonly options: SearchPoolOptions) {}

  /** Tasks running or waiting for a thread. */
  get pending(): number {
    return this.inFlight;
  }

  /** Worker threads alive now (started, starting or idle). */
  get threads(): number {
    return this.piscina?.threads.length ?? 0;
  }

  search(input: SearchInput): Promise<SearchResult> {
    return this.run({ kind: 'search', input });
  }

  /** The search route's answer, as JSON bytes (gzipped if asked) ready for the socket. */
  searchAnswer(input: SearchInput, { gzip }: { gzip: boolean }): Promise<Uint8Array> {
    return this.run({ kind: 'search-answer', input, gzip });
  }

  compareMaterials(input: MaterialComparisonInput): Promise<MaterialComparison> {
    return this.run({ kind: 'compare', input });
  }

  /** A material's fit from its loss points (10,000 points: about 0.4 s, more in many bands). */
  fitMaterial(input: MaterialFitInput): Promise<MaterialFit> {
    return this.run({ kind: 'fit', input });
  }

  /** Starts the first thread now, so the first search does not wait for it (the server calls this once listening). */
  warm(): void {
    if (this.options.workers > 0 && !this.closing) this.workers();
  }

  /** Lets running and waiting tasks finish, then ends the threads; later tasks are refused as busy. */
  close(): Promise<void> {
    return (this.closing ??= this.piscina?.close() ?? Promise.resolve());
  }

  private async run<K extends EngineTask['kind']>(task: Extract<EngineTask, { kind: K }>): Promise<EngineTaskResults[K]> {
    const outcome = (this.options.workers === 0 ? runEngineTask(task) : await this.dispatch(task)) as EngineTaskOutcome<K>;
    if (!outcome.ok) throw new EngineInputError(outcome.field, outcome.message);
    return outcome.value;
  }

  private async dispatch(task: EngineTask): Promise<EngineTaskOutcome> {
    // Counted here rather than left to piscina, whose queue limit also counts threads still starting.
    if (this.closing || this.inFlight >= this.options.workers + this.options.queue) throw searchBusy();
    this.inFlight++;
    try {
      return await this.workers().run(task);
    } finally {
      this.inFlight--;
    }
  }

  private workers(): Piscina<EngineTask, EngineTaskOutcome> {
    return (this.piscina ??= new Piscina({
      filename: WORKER_ENTRY,
      minThreads: 1,
      maxThreads: this.options.workers,
      idleTimeout: this.options.idleMs,
      // Never the limit in practice: admission is decided by the count above.
      maxQueue: this.options.workers + this.options.queue,
      niceIncrement: this.options.nice,
    }));
  }
}
