import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadConfig } from '../config.ts';
import { startCheckWorkers } from './check-workers.ts';
import { ensureClientBuild } from './client-build.ts';
import { clusterPaths, ensureCluster, ensureDatabase } from './postgres.ts';
import { fileSecret } from './secrets.ts';
import { ensureSolverTools } from './solver-tools.ts';

// `npm start`: database, solvers, secrets, web app build, then the server in this same process and the check workers
// (CHECK_WORKERS, default 1) as processes of their own.
const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
const started = Date.now();

if (!process.env['DATABASE_URL']) {
  const cluster = ensureCluster();
  ensureDatabase('gapwright');
  process.env['DATABASE_URL'] = cluster.urlFor('gapwright');
} else {
  process.stdout.write('[postgres] using DATABASE_URL from the environment\n');
}
process.env['SESSION_SECRET'] ??= fileSecret(path.join(clusterPaths().root, 'session-secret'));
process.env['STATIC_DIR'] ??= path.join(repoRoot, 'dist/gapwright/browser');
ensureClientBuild(repoRoot, 'dist/gapwright/browser/index.html');
ensureSolverTools();

process.stdout.write(`[start] ready to serve after ${((Date.now() - started) / 1000).toFixed(1)} s of preparation\n`);
await import('../main.ts');
// The server has migrated the database by now: the workers find their table.
startCheckWorkers(repoRoot, loadConfig().checkWorkers);
