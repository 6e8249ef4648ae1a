import { ensureCluster, ensureDatabase, stopCluster } from './postgres.ts';

const command = process.argv[2];
if (command === 'start') {
  const cluster = ensureCluster();
  ensureDatabase('gapwright');
  process.stdout.write(`PostgreSQL is up on 127.0.0.1:${cluster.port} (data in ${cluster.dataDir}).\n`);
} else if (command === 'stop') {
  stopCluster();
} else {
  process.stderr.write('usage: node --import tsx server/ops/db.ts start|stop\n');
  process.exit(2);
}
