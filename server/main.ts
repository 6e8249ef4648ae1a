import { loadConfig } from './config.ts';
import { startServer } from './server.ts';

const SHUTDOWN_GRACE_MS = 10_000;

const running = await startServer(loadConfig());

function shutdown(signal: string): void {
  process.stdout.write(`\n${signal} received: finishing open requests, then stopping.\n`);
  const force = setTimeout(() => process.exit(1), SHUTDOWN_GRACE_MS);
  force.unref();
  running.stop().then(
    () => process.exit(0),
    (err: unknown) => {
      console.error(err);
      process.exit(1);
    },
  );
}
process.once('SIGTERM', () => shutdown('SIGTERM'));
process.once('SIGINT', () => shutdown('SIGINT'));
