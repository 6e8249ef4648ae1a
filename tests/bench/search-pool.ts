import os from 'node:os';
import { fileURLToPath } from 'node:url';
import { fork } from 'node:child_process';
import { searchCandidates } from '@shared/engine/index';
import { dropDatabase, ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { startServerProcess, type ServerProcess } from '../support/server-process.ts';
import { SessionClient, type Answer } from '../support/session-client.ts';
import { BENCH_SPEC, inventedMaterials, loadCatalogue, type BenchRow } from './engine.ts';
import type { SearchLoadCounts, SearchLoadData, SearchLoadMessage } from './search-load.ts';
import { healthTimes } from './health-probe.ts';
import { percentile } from './stats.ts';

// The search as the workspace asks for it (full catalogue, 20 invented materials, best 50), through the HTTP API of
// the real server in its own process; then whether searches stall everybody else: GET /api/health idle and while
// 8 connections search back to back. `SEARCH_WORKERS=0 npm run bench -- search` measures the inline path (no pool).
// On its own: node --import tsx tests/bench/search-pool.ts

const SEARCH_TARGET_MS = 100;
const HEALTH_RATIO_TARGET = 2;
const LIMIT = 50; // what the workspace asks for (src/app/designs/designs-api.ts)
const IDLE_MS = 2000;
const BUSY_MS = 3000;
const RAMP_MS = 500;
const CLIENT_NICE = 10;

const ms = (v: number) => `${v.toFixed(1)} ms`;
const sorted = (list: readonly number[]) => [...list].sort((a, b) => a - b);

async function timed(task: () => Promise<unknown>): Promise<number> {
  const started = performance.now();
  await task();
  return performance.now() - started;
}

/**
 * Where a search's time goes, measured in this process: the engine, the copy of its input into a worker (the answer
 * comes back as bytes handed over, not copied), and encoding the answer as JSON bytes (done in the worker).
 */
async function searchParts(runs: number) {
  const { cores, wires } = await loadCatalogue();
  const input = { spec: BENCH_SPEC, cores, materials: inventedMaterials(), wires, limit: LIMIT };
  const parts = { engine: [] as number[], clone: [] as number[], json: [] as number[] };
  let bytes = 0;
  for (let i = 0; i < runs + 5; i++) {
    let started = performance.now();
    const result = searchCandidates(input);
    const engine = performance.now() - started;
    started = performance.now();
    structuredClone(input);
    const clone = performance.now() - started;
    started = performance.now();
    bytes = new TextEncoder().encode(JSON.stringify(result)).byteLength;
    const json = performance.now() - started;
    if (i < 5) continue;
    parts.engine.push(engine);
    parts.clone.push(clone);
    parts.json.push(json);
  }
  return { ...parts, bytes, cores: cores.length };
}

/** The searching connections, run by search-load.ts in a process of its own. */
function searchLoad(data: SearchLoadData) {
  const child = fork(fileURLToPath(new URL('./search-load.ts', import.meta.url)), { stdio: 'ignore' });
  // Searching users are browsers on other machines: here their reading of ~80 answers a second shares the bench
  // machine's cores with the server they load, so they get a lower CPU priority, as if elsewhere.
  os.setPriority(child.pid!, CLIENT_NICE);
  const exited = new Promise((resolve) => child.once('exit', resolve));
  const send = (message: SearchLoadMessage) => child.send(message);
  const ask = (message: SearchLoadMessage) =>
    new Promise<SearchLoadCounts>((resolve, reject) => {
      const ended = () => reject(new Error('the search load process ended before answering'));
      child.once('exit', ended);
      child.once('message', (counts) => {
        child.off('exit', ended);
        resolve(counts as SearchLoadCounts);
      });
      send(message);
    });
  send({ start: data });
  return {
    on: () => send('on'),
    off: () => ask('off'),
    stop: async () => {
      const counts = await ask('stop');
      await exited;
      return counts;
    },
    /** For a bench that failed half-way: the loops must not outlive it. */
    kill: () => child.exitCode === null && child.kill(),
  };
}

export async function runSearchBench({ runs = 40, connections = 8, rounds = 6 } = {}): Promise<BenchRow[]> {
  // The in-process searches come first, before any connection to the server exists: they block this process's event
  // loop for (runs + 5) searches, and a keep-alive socket left idle across that longer than the server's 5 s
  // keep-alive is closed by the server before the client's own timer can retire it; the next request on it then
  // failed with "other side closed".
  const parts = await searchParts(runs);
  const database = `gapwright_bench_search_${Date.now().toString(36)}`;
  const cluster = ensureCluster();
  ensureDatabase(database);
  let server: ServerProcess | undefined;
  let load: ReturnType<typeof searchLoad> | undefined;
  try {
    server = await startServerProcess(cluster.urlFor(database), { NODE_ENV: 'production' });
    const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
    const client = await SessionClient.signIn(server.baseUrl, engineer.username, engineer.password);
    const body = { spec: BENCH_SPEC, materials: inventedMaterials(), limit: LIMIT };
    const first = (await client.expectOk('POST', '/api/calc/search', body)) as { counts: { cores: number; evaluated: number } };

    // (a) One search at a time, timed by the client: the server's time plus a loopback round trip.
    // Beside it, the same path with next to no engine work (the operating point): what HTTP, the session and the
    // client's reading cost on this machine right now.
    const search: number[] = [];
    const serverSide: number[] = [];
    const floor: number[] = [];
    for (let i = 0; i < runs + 5; i++) {
      let answer: Answer | undefined;
      const time = await timed(async () => (answer = await client.send('POST', '/api/calc/search', body)));
      if (answer?.status !== 200 || answer.serverTiming === undefined)
        throw new Error(`search answered ${answer?.status} without Server-Timing`);
      const floorTime = await timed(() => client.expectOk('POST', '/api/calc/operating-point', BENCH_SPEC));
      if (i < 5) continue;
      search.push(time);
      serverSide.push(answer.serverTiming);
      floor.push(floorTime);
    }

    // (b) Health alone, then beside `connections` connections searching back to back, in turns: the machine's other
    // load drifts, and idle and busy rounds side by side see the same drift.
    load = searchLoad({
      url: `${server.baseUrl}/api/calc/search`,
      headers: client.headers('POST', true),
      body: JSON.stringify(body),
      connections,
    });
    await healthTimes(server.baseUrl, 500);
    const idle: number[] = [];
    const busy: number[] = [];
    for (let round = 0; round < rounds; round++) {
      idle.push(...(await healthTimes(server.baseUrl, IDLE_MS)));
      load.on();
      await new Promise((r) => setTimeout(r, RAMP_MS)); // every connection has a search in flight
      busy.push(...(await healthTimes(server.baseUrl, BUSY_MS)));
      await load.off();
    }
    const counts = await load.stop();

    const idleP95 = percentile(sorted(idle), 95);
    const busyP95 = percentile(sorted(busy), 95);
    const ratio = busyP95 / idleP95;
    const p = (list: number[]) => `${ms(percentile(sorted(list), 50))} / ${ms(percentile(sorted(list), 95))}`;
    return [
      {
        name: `search via API: ${first.counts.cores} cores × 20 invented materials, best ${LIMIT}`,
        value: `${first.counts.evaluated} evaluated; SEARCH_WORKERS=${process.env['SEARCH_WORKERS'] ?? 'default'}`,
      },
      {
        name: `search on the server (Server-Timing: queue, worker, engine, encoding) p50 / p95 (${runs} runs, one at a time)`,
        value: `${p(serverSide)} (target p95 ≤ ${SEARCH_TARGET_MS} ms: ${percentile(sorted(serverSide), 95) <= SEARCH_TARGET_MS ? 'met' : 'NOT met'})`,
      },
      { name: '  the same searches timed by the client (plus HTTP, session, loopback, reading the answer)', value: p(search) },
      { name: '  the same path without a search (POST /api/calc/operating-point) p50 / p95', value: p(floor) },
      {
        name: `  per search in this process: engine / input copy / JSON bytes, p50 / p95`,
        value: `${p(parts.engine)}; ${p(parts.clone)}; ${p(parts.json)} (${(parts.bytes / 1024).toFixed(0)} KiB answer, in-process, ${parts.cores} cores)`,
      },
      { name: 'GET /api/health p95 idle', value: `${ms(idleP95)} (${idle.length} requests)` },
      {
        name: `GET /api/health p95, ${connections} connections searching (clients at nice ${CLIENT_NICE})`,
        value: `${ms(busyP95)} = ${ratio.toFixed(2)} × idle (target ≤ ${HEALTH_RATIO_TARGET} ×: ${ratio <= HEALTH_RATIO_TARGET ? 'met' : 'NOT met'}; ${busy.length} requests)`,
      },
      {
        name: `  searches meanwhile (${rounds} rounds of ${BUSY_MS / 1000} s)`,
        value: `${counts.searches} answered (${(counts.searches / ((rounds * (RAMP_MS + BUSY_MS)) / 1000)).toFixed(1)}/s), ${counts.failed} not 2xx`,
      },
    ];
  } catch (error) {
    // A server that died mid-bench says why on its stderr: keep it with the error.
    const tail = server?.stderrTail().trim();
    if (tail) throw new Error(`${(error as Error).message}\nserver stderr (exit ${server?.child.exitCode}):\n${tail}`, { cause: error });
    throw error;
  } finally {
    load?.kill();
    server?.child.kill('SIGTERM');
    await server?.exited;
    dropDatabase(database);
  }
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const rows = await runSearchBench();
  const width = Math.max(...rows.map((r) => r.name.length));
  for (const row of rows) process.stdout.write(`  ${row.name.padEnd(width)}  ${row.value}\n`);
}
