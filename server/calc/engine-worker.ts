// Entry file of the engine's worker threads (piscina calls the default export once per task).
import { runEngineTask } from './engine-tasks.ts';

export default runEngineTask;
