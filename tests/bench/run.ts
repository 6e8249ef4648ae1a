import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureClientBuild } from '../../server/ops/client-build.ts';
import { measureInitialBundle } from './bundle.ts';
import { runChecksBench } from './checks.ts';
import { runEngineBench, type BenchRow } from './engine.ts';
import { runHttpLoadBench } from './http-load.ts';
import { runLossPointsBench } from './loss-points.ts';
import { runImportBench } from './material-import.ts';
import { runOutageBench } from './outage.ts';
import { runSearchBench } from './search-pool.ts';
import { runSignedInPathBench } from './signed-in-path.ts';
import { runWorkspaceBench } from './workspace.ts';

// `npm run bench`: one table of the figures the speed targets are judged on.
const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

// Sections by name: `npm run bench -- signed-in outage` runs only those; no names runs every section.
const SECTIONS: Record<string, () => Promise<BenchRow[]> | BenchRow[]> = {
  engine: runEngineBench,
  search: runSearchBench,
  http: runHttpLoadBench,
  'signed-in': runSignedInPathBench,
  import: runImportBench,
  'loss-points': runLossPointsBench,
  checks: runChecksBench,
  workspace: runWorkspaceBench,
  outage: runOutageBench,
  bundle: () => measureInitialBundle(path.join(repoRoot, 'dist/gapwright/browser')),
};
const asked = process.argv.slice(2);
const unknown = asked.filter((name) => !(name in SECTIONS));
if (unknown.length) {
  process.stderr.write(`Unknown bench section(s): ${unknown.join(', ')}. Sections: ${Object.keys(SECTIONS).join(', ')}.
`);
  process.exit(2);
}
// The workspace timings and the bundle size are of the web app as the sources stand: rebuild it when stale.
const sections = asked.length ? asked : Object.keys(SECTIONS);
if (sections.includes('workspace') || sections.includes('bundle')) ensureClientBuild(repoRoot, 'dist/gapwright/browser/index.html');
const rows: BenchRow[] = [];
for (const name of sections) rows.push(...(await SECTIONS[name]!()));

const width = Math.max(...rows.map((r) => r.name.length));
process.stdout.write(
  `\nGapwright benchmark — ${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} cores, ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}\n\n`,
);
for (const row of rows) process.stdout.write(`  ${row.name.padEnd(width)}  ${row.value}\n`);
process.stdout.write('\n');
