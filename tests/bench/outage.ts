import { fileURLToPath } from 'node:url';
import { OutageRig, type OutageTrialResult } from '../support/outage-trial.ts';
import type { BenchRow } from './engine.ts';

// PostgreSQL stopped in fast mode under 8–13 loops of writes, twenty times: how often does the server die?
// A section of `npm run bench`; on its own: `node --import tsx tests/bench/outage.ts [trials]`.

export async function runOutageBench(trials = 20): Promise<BenchRow[]> {
  const rig = await OutageRig.create('outage-bench');
  const results: OutageTrialResult[] = [];
  try {
    for (let i = 0; i < trials; i++) {
      const started = Date.now();
      const result = await rig.trial(8 + (i % 6), { loadBeforeStopMs: 300 + (i % 4) * 150 });
      process.stderr.write(`outage trial ${i + 1}: ${result.crashed ? 'crashed' : 'survived'} in ${Date.now() - started} ms\n`);
      results.push(result);
      if (result.crashed) process.stderr.write(`outage trial ${i + 1} crashed:\n${result.crashOutput.slice(-800)}\n`);
      for (const answer of result.unexpected) process.stderr.write(`outage trial ${i + 1} answered: ${answer}\n`);
    }
  } finally {
    await rig.close();
  }
  const crashed = results.filter((r) => r.crashed).length;
  process.stdout.write(`outage trials: ${crashed} of ${trials} crashed\n`);
  const statuses: Record<number, number> = {};
  for (const r of results)
    for (const [status, n] of Object.entries(r.statuses)) statuses[Number(status)] = (statuses[Number(status)] ?? 0) + n;
  const others = Object.entries(statuses).filter(([s]) => !['200', '201', '503'].includes(s));
  return [
    { name: 'outage trials crashed', value: `${crashed} of ${trials}` },
    {
      name: 'outage answers',
      value: Object.entries(statuses)
        .map(([s, n]) => `${n}× ${s === '0' ? 'no answer' : s}`)
        .join(', '),
    },
    { name: 'outage answers other than 200/201/503', value: others.length ? others.map(([s, n]) => `${n}× ${s}`).join(', ') : 'none' },
    { name: 'outage trials not recovered', value: String(results.filter((r) => !r.recovered).length) },
    {
      name: 'outage half-written records',
      value: `${results.at(-1)?.designsWithoutRevision ?? 0} designs without a revision, ${results.at(-1)?.unitsWithoutAudit ?? 0} units without an audit entry`,
    },
  ];
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const rows = await runOutageBench(Number(process.argv[2] ?? 20));
  for (const row of rows) process.stdout.write(`  ${row.name}: ${row.value}\n`);
}
