import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { EventEmitter } from 'node:events';
import autocannon, { type Result } from 'autocannon';
import { dropDatabase, ensureCluster, ensureDatabase } from '../../server/ops/postgres.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import type { BenchRow } from './engine.ts';

// Load on the real server, in its own process, over loopback only, bounded in time.
const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
const SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;
const ms = (v: number) => `${v.toFixed(1)} ms`;
const rssOf = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) / 1024;

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

export async function runHttpLoadBench({ durationSeconds = 30, connections = 50 } = {}): Promise<BenchRow[]> {
  const database = `gapwright_bench_${Date.now().toString(36)}`;
  const cluster = ensureCluster();
  ensureDatabase(database);
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(process.execPath, ['--import', 'tsx', path.join(repoRoot, 'server/main.ts')], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      DATABASE_URL: cluster.urlFor(database),
      SESSION_SECRET: 'bench-session-secret-that-is-long-enough-0123456789',
      LOG_LEVEL: 'silent',
      FAKE_SMTP_PORT: '0',
    },
    stdio: 'ignore',
  });
  try {
    for (let i = 0; i < 200; i++) {
      if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) break;
      await new Promise((r) => setTimeout(r, 200));
    }
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
    keep(await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: headers(), body: JSON.stringify({ username: engineer.username, password: engineer.password }) }));
    const materialIds = ((await (await fetch(`${base}/api/materials`, { headers: headers() })).json()) as { materials: { id: string }[] }).materials.map((m) => m.id);
    const searchBody = JSON.stringify({ spec: SPEC, materialIds, limit: 20 });
    const search = (await (await fetch(`${base}/api/calc/search`, { method: 'POST', headers: headers(), body: searchBody })).json()) as {
      candidates: { result: { core: { id: string }; material: { id: string }; turns: number }; wire: { kind: string; strandDiameter: number; strands: number } }[];
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

    const rssStart = rssOf(server.pid!);
    const latencies: number[] = [];
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
    const probe: Record<string, number[]> = { health: [], evaluate: [], search: [] };
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
    const rssEnd = rssOf(server.pid!);

    latencies.sort((a, b) => a - b);
    const p95 = (name: string) => percentile([...probe[name]].sort((a, b) => a - b), 95);
    return [
      { name: `HTTP load (${connections} connections, ${durationSeconds} s, mixed signed-in routes)`, value: `${result.requests.total} requests, ${result.requests.average.toFixed(0)} req/s` },
      { name: 'HTTP load errors / timeouts / non-2xx', value: `${result.errors} / ${result.timeouts} / ${result.non2xx}` },
      { name: 'HTTP load latency p50 / p95 / p99', value: `${ms(percentile(latencies, 50))} / ${ms(percentile(latencies, 95))} / ${ms(percentile(latencies, 99))}` },
      { name: 'under that load: health p95', value: ms(p95('health')) },
      { name: 'under that load: evaluate p95', value: ms(p95('evaluate')) },
      { name: 'under that load: search p95', value: ms(p95('search')) },
      { name: 'under that load: calc p95 / health p95', value: `evaluate ${(p95('evaluate') / p95('health')).toFixed(2)}, search ${(p95('search') / p95('health')).toFixed(2)}` },
      { name: 'server RSS start → end', value: `${rssStart.toFixed(0)} MB → ${rssEnd.toFixed(0)} MB` },
    ];
  } finally {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    dropDatabase(database);
  }
}
