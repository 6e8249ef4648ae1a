// The file piscina starts each engine thread with. The engine is loaded as ES modules through tsx's module hooks,
// registered here: left to the inherited `--import tsx`, a worker thread on Node 20 loads it through tsx's CommonJS
// hook instead, and the engine ran about 1.6× slower there (bench: one search 95 ms against 54 ms in the main thread).
import { register } from 'tsx/esm/api';

register();
const { default: runInWorker } = await import('./engine-worker.ts');

export default runInWorker;
