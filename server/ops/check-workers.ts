import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

/**
 * Starts `count` check worker processes beside the web server (same environment, so the same DATABASE_URL), and
 * starts one again if it dies. They stop with this process.
 */
export function startCheckWorkers(repoRoot: string, count: number): void {
  const children = new Set<ChildProcess>();
  let stopping = false;
  const launch = (n: number) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(repoRoot, 'server/workers/check-worker.ts')], {
      cwd: repoRoot,
      env: process.env,
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    children.add(child);
    child.on('exit', (code, signal) => {
      children.delete(child);
      if (stopping) return;
      process.stdout.write(`[workers] check worker ${n} ended (${signal ?? code}); starting it again in 5 s\n`);
      setTimeout(() => !stopping && launch(n), 5000).unref();
    });
  };
  for (let n = 1; n <= count; n++) launch(n);
  if (count > 0) process.stdout.write(`[workers] ${count} check worker process${count === 1 ? '' : 'es'} started\n`);
  const stopAll = () => {
    stopping = true;
    for (const child of children) child.kill('SIGTERM');
  };
  process.once('SIGTERM', stopAll);
  process.once('SIGINT', stopAll);
  process.once('exit', stopAll);
}
