import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { dropDatabase, ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { freePort, startServerProcess } from '../support/server-process.ts';
import type { BenchRow } from './engine.ts';

// The signed-in path against its floor, in one run on one database: a bare Express 5 + pg route (floor-server.ts)
// and Gapwright's signed-in list routes, each under the same load, one after the other. The ratio is what counts:
// absolute figures move with whatever else the machine is doing.
const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

async function startFloor(databaseUrl: string) {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/floor-server.ts'], {
    cwd: repoRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port) },
    stdio: 'ignore',
  });
  const exited = new Promise((resolve) => child.once('exit', resolve));
  const url = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 100; i++) {
    if (
      await fetch(`${url}/bare`).then(
        (r) => r.ok,
        () => false,
      )
    )
      return { url, stop: () => (child.kill('SIGTERM'), exited) };
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill('SIGKILL');
  throw new Error('the floor server did not come up');
}

async function reqPerSecond(url: string, headers: Record<string, string>, connections: number, duration: number): Promise<number> {
  const result = await autocannon({ url, connections, duration, headers });
  if (result.non2xx || result.errors) throw new Error(`${url}: ${result.non2xx} non-2xx, ${result.errors} errors`);
  return result.requests.average;
}

export async function runSignedInPathBench({ durationSeconds = 15, connections = 50, rounds = 5 } = {}): Promise<BenchRow[]> {
  const database = `gapwright_bench_floor_${Date.now().toString(36)}`;
  const cluster = ensureCluster();
  ensureDatabase(database);
  const databaseUrl = cluster.urlFor(database);
  // As deployed: production mode, request logging on (to /dev/null here, so the figure is the cost of making the lines).
  const app = await startServerProcess(databaseUrl, { NODE_ENV: 'production', LOG_LEVEL: 'info' });
  const floor = await startFloor(databaseUrl);
  try {
    const jar = new Map<string, string>();
    const keep = (res: Response) => {
      for (const c of res.headers.getSetCookie()) {
        const [pair] = c.split(';');
        const at = pair.indexOf('=');
        jar.set(pair.slice(0, at), pair.slice(at + 1));
      }
      return res;
    };
    const headers = () => ({
      cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '),
      'x-xsrf-token': decodeURIComponent(jar.get('XSRF-TOKEN') ?? ''),
      'content-type': 'application/json',
    });
    keep(await fetch(`${app.baseUrl}/api/auth/session`));
    const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
    const signIn = keep(
      await fetch(`${app.baseUrl}/api/auth/sign-in`, {
        method: 'POST',
        headers: headers(),
        body: JSON.stringify({ username: engineer.username, password: engineer.password }),
      }),
    );
    if (!signIn.ok) throw new Error(`sign-in failed: ${signIn.status}`);
    const run = (url: string, h: Record<string, string> = {}) => reqPerSecond(url, h, connections, durationSeconds / rounds);

    // Short runs taken in turns, each route right after its floor, so a change in the machine's load between the two
    // hardly moves the ratio; the median of the rounds is reported.
    const pairs: Record<'materials' | 'designs' | 'health', [number, number][]> = { materials: [], designs: [], health: [] };
    for (let round = 0; round < rounds; round++) {
      const floorRate = await run(`${floor.url}/floor`);
      pairs.materials.push([await run(`${app.baseUrl}/api/materials`, headers()), floorRate]);
      pairs.designs.push([await run(`${app.baseUrl}/api/designs`, headers()), floorRate]);
      const bare = await run(`${floor.url}/bare`);
      pairs.health.push([await run(`${app.baseUrl}/api/health`), bare]);
    }
    const median = (list: [number, number][]) => [...list].sort((a, b) => a[0] / a[1] - b[0] / b[1])[Math.floor(list.length / 2)];
    const ratio = (list: [number, number][], of: string) => {
      const [rate, base] = median(list);
      return `${rate.toFixed(0)} req/s = ${(rate / base).toFixed(2)} of ${of} (${base.toFixed(0)} req/s)`;
    };
    return [
      {
        name: 'signed-in path vs its floor (bare Express 5 + one pg query)',
        value: `${connections} connections, ${rounds} rounds of ${durationSeconds / rounds} s each, median`,
      },
      { name: 'signed-in GET /api/materials', value: ratio(pairs.materials, 'the floor') },
      { name: 'signed-in GET /api/designs', value: ratio(pairs.designs, 'the floor') },
      { name: 'GET /api/health', value: ratio(pairs.health, 'a bare Express route') },
    ];
  } finally {
    await floor.stop();
    app.child.kill('SIGTERM');
    await app.exited;
    dropDatabase(database);
  }
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  for (const row of await runSignedInPathBench({ durationSeconds: Number(process.argv[2] ?? 15) }))
    process.stdout.write(`${row.name}: ${row.value}\n`);
}
