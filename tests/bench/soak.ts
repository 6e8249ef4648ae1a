import { runHttpLoadBench } from './http-load.ts';

// `npm run bench:soak`: the HTTP load of `npm run bench` repeated back to back, to tell a leak (RSS climbing every
// round) from warm-up (RSS levelling off). Rounds and their length from the command line: `-- 10 30`.
const [rounds = 8, seconds = 30] = process.argv.slice(2).map(Number);
const rows = await runHttpLoadBench({ rounds, durationSeconds: seconds });
for (const row of rows) process.stdout.write(`  ${row.name}: ${row.value}\n`);
