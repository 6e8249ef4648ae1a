import { readFileSync } from 'node:fs';
import type { EventEmitter } from 'node:events';
import autocannon, { type Result } from 'autocannon';
import { dropDatabase, ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { startServerProcess } from '../support/server-process.ts';
import type { BenchRow } from './engine.ts';
import { percentile } from './stats.ts';

// Load on the real server, in its own process, over loopback only, bounded in time.
const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

const ms = (v: number) => `${v.toFixed(1)} ms`;
const rssOf = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) / 1024;

/** `rounds` > 1 repeats the load back to back and reports the server's RSS after each round (a soak). */
export async function runHttpLoadBench({ durationSeconds = 30, connections = 50, rounds = 1 } = {}): Promise<BenchRow[]> {
  const database = `gapwright_bench_${Date.now().toString(36)}`;
  const cluster = ensureCluster();
  ensureDatabase(database);
  const server = await startServerProcess(cluster.urlFor(database), { NODE_ENV: 'production' });
  const base = server.baseUrl;
  try {
    // Sign in once; every connection uses the same session, as many tabs of one user would.
    const jar = new Map<string, string>();
    const keep = (res: Response) => {
      for (const c of res.headers.getSetCookie()) {
        const [pair] = c.split(';');
        const [name, value] = pair.split('=');
        jar.set(name, value);
      }
      return res;
    };
    const headers = () => ({
      cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '),
      'x-xsrf-token': decodeURIComponent(jar.get('XSRF-TOKEN') ?? ''),
      'content-type': 'application/json',
    });
    keep(await fetch(`${base}/api/auth/session`));
    const engineer = DEMO_USERS.find((u) => u.role === 'engineer')!;
    keep(
      await fetch(`${base}/api/auth/sign-in`, {
        method: 'POST',
        headers: headers(),
        body: JSON.stringify({ username: engineer.username, password: engineer.password }),
      }),
    );
    const materialIds = (
      (await (await fetch(`${base}/api/materials`, { headers: headers() })).json()) as { materials: { id: string }[] }
    ).materials.map((m) => m.id);
    const searchBody = JSON.stringify({ spec: SPEC, materialIds, limit: 20 });
    const search = (await (await fetch(`${base}/api/calc/search`, { method: 'POST', headers: headers(), body: searchBody })).json()) as {
      candidates: {
        result: { core: { id: string }; material: { id: string }; turns: number };
        wire: { kind: string; strandDiameter: number; strands: number };
      }[];
    };
    const best = search.candidates[0];
    const evaluateBody = JSON.stringify({
      spec: SPEC,
      coreId: best.result.core.id,
      materialId: best.result.material.id,
      turns: best.result.turns,
      gap: 'auto',
      wire: { kind: best.wire.kind, strandDiameter: best.wire.strandDiameter, strands: best.wire.strands },
    });

    const rssStart = rssOf(server.child.pid!);
    const rssAfterRound: number[] = [];
    const latencies: number[] = [];
    const probe: Record<string, number[]> = { health: [], evaluate: [], search: [] };
    const totals = { requests: 0, errors: 0, timeouts: 0, non2xx: 0 };
    for (let round = 0; round < rounds; round++) {
      // Without a callback autocannon returns its instance, an event emitter that is also a promise of the result.
      const load = autocannon({
        url: base,
        connections,
        duration: durationSeconds,
        headers: headers(),
        requests: [
          { method: 'GET', path: '/api/designs' },
          { method: 'POST', path: '/api/calc/evaluate', body: evaluateBody },
          { method: 'POST', path: '/api/calc/search', body: searchBody },
          { method: 'GET', path: '/api/materials' },
        ],
      }) as unknown as Promise<Result> & EventEmitter;
      load.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => latencies.push(responseTime));

      // A probe beside the load: one request at a time, timed per route, under the same load.
      let running = true;
      const probing = (async () => {
        while (running) {
          for (const [name, init, url] of [
            ['health', { headers: headers() }, '/api/health'],
            ['evaluate', { method: 'POST', headers: headers(), body: evaluateBody }, '/api/calc/evaluate'],
            ['search', { method: 'POST', headers: headers(), body: searchBody }, '/api/calc/search'],
          ] as const) {
            const started = performance.now();
            await fetch(`${base}${url}`, init).then((r) => r.arrayBuffer());
            probe[name].push(performance.now() - started);
          }
        }
      })();
      const result = await load;
      running = false;
      await probing;
      totals.requests += result.requests.total;
      totals.errors += result.errors;
      totals.timeouts += result.timeouts;
      totals.non2xx += result.non2xx;
      rssAfterRound.push(rssOf(server.child.pid!));
    }
    const seconds = durationSeconds * rounds;

    latencies.sort((a, b) => a - b);
    const p95 = (name: string) =>
      percentile(
        [...probe[name]].sort((a, b) => a - b),
        95,
      );
    return [
      {
        name: `HTTP load (${connections} connections, ${seconds} s, mixed signed-in routes)`,
        value: `${totals.requests} requests, ${(totals.requests / seconds).toFixed(0)} req/s`,
      },
      { name: 'HTTP load errors / timeouts / non-2xx', value: `${totals.errors} / ${totals.timeouts} / ${totals.non2xx}` },
      {
        name: 'HTTP load latency p50 / p95 / p99',
        value: `${ms(percentile(latencies, 50))} / ${ms(percentile(latencies, 95))} / ${ms(percentile(latencies, 99))}`,
      },
      { name: 'under that load: health p95', value: ms(p95('health')) },
      { name: 'under that load: evaluate p95', value: ms(p95('evaluate')) },
      { name: 'under that load: search p95', value: ms(p95('search')) },
      {
        name: 'under that load: calc p95 / health p95',
        value: `evaluate ${(p95('evaluate') / p95('health')).toFixed(2)}, search ${(p95('search') / p95('health')).toFixed(2)}`,
      },
      {
        name: rounds > 1 ? `server RSS start → after each ${durationSeconds} s round` : 'server RSS start → end',
        value: [rssStart, ...rssAfterRound].map((mb) => mb.toFixed(0)).join(' → ') + ' MB',
      },
    ];
  } finally {
    server.child.kill('SIGTERM');
    await server.exited;
    dropDatabase(database);
  }
}
