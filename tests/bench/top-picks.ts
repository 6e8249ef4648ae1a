// The top three picks of the search for the example specs A–F, as a designer sees them through the API with the
// demo material library: core, material, turns, wire, gap, volume, loss, rise and warnings.
// Run: node --import tsx tests/bench/top-picks.ts  (needs the own cluster: npm run db:start)
import { dropDatabase, ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import type { SearchAnswer } from '@shared/schemas/calc-answers';
import { EXAMPLE_SPECS } from '../support/example-specs.ts';
import { startServerProcess } from '../support/server-process.ts';
import { SessionClient } from '../support/session-client.ts';

type Pick = SearchAnswer['candidates'][number];

const cluster = ensureCluster();
const name = `gapwright_picks_${process.pid}`;
ensureDatabase(name);
const server = await startServerProcess(cluster.urlFor(name), { SEED_DEMO: 'true' });
try {
  const client = await SessionClient.signIn(server.baseUrl, 'erin', 'demo-engineer-2026');
  const materials = (await client.expectOk('GET', '/api/materials')) as { materials?: { id: number }[] } | { id: number }[];
  const list = Array.isArray(materials) ? materials : (materials.materials ?? []);
  const materialIds = list.map((m) => String(m.id));
  for (const [label, spec] of Object.entries(EXAMPLE_SPECS)) {
    const answer = (await client.expectOk('POST', '/api/calc/search', { spec, materialIds, limit: 3 })) as SearchAnswer;
    console.log(`\n${label}: ${JSON.stringify(spec)}  feasible ${answer.counts['feasible']}`);
    for (const c of answer.candidates) console.log(`  #${c.rank} ${describe(c)}`);
  }
} finally {
  server.child.kill('SIGTERM');
  await server.exited;
  dropDatabase(name);
}

function describe({ result: r, wire }: Pick): string {
  const warnings = r.issues.filter((i) => i.severity === 'warning').map((i) => i.code);
  return [
    r.core.id,
    r.material.name,
    `N=${r.turns}`,
    wire.id,
    r.core.gapKind === 'distributed'
      ? 'distributed gap'
      : r.gap.placement === 'spacer'
        ? `spacer ${(r.gap.spacer * 1e3).toFixed(3)} mm`
        : `ground gap ${(r.gap.total * 1e3).toFixed(3)} mm`,
    `Ve=${(r.core.ve * 1e6).toFixed(2)} cm³`,
    `loss=${r.totalLoss.toFixed(3)} W`,
    `rise=${r.thermal.rise.toFixed(1)} K`,
    warnings.length ? `warn=${warnings.join(',')}` : '',
  ].join('  ');
}
