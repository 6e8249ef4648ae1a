import { execFileSync, spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureClientBuild } from '../server/ops/client-build.ts';
import { dropDatabase, ensureCluster, ensureDatabase } from '../server/ops/postgres.ts';
import { installDebianPackages, missingPackages, type DebianTool } from '../server/ops/debian-packages.ts';
import { SOLVER_TOOLS } from '../server/ops/solver-tools.ts';

// `npm test`: every suite, each with what it needs (a throwaway database per run, Debian's
// Chromium, a fresh web build), ending with one "passed, failed" line.
const repoRoot = fileURLToPath(new URL('..', import.meta.url));
const resultsDir = path.join(repoRoot, 'test-results');
const SUITES = ['types', 'lint', 'unit', 'component', 'api', 'browser'] as const;
type Suite = (typeof SUITES)[number];

const requested = process.argv.slice(2).filter((a): a is Suite => (SUITES as readonly string[]).includes(a));
const suites: Suite[] = requested.length ? requested : [...SUITES];

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}
const totals: Record<string, Counts> = {};
const seconds: Record<string, number> = {};

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: repoRoot, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    const forward = (chunk: Buffer, to: NodeJS.WriteStream) => {
      output += chunk.toString();
      to.write(chunk);
    };
    child.stdout.on('data', (c: Buffer) => forward(c, process.stdout));
    child.stderr.on('data', (c: Buffer) => forward(c, process.stderr));
    child.on('close', (code) => resolve({ code: code ?? 1, output }));
  });
}

function countsFromVitestJson(file: string): Counts | undefined {
  if (!existsSync(file)) return undefined;
  const report = JSON.parse(readFileSync(file, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
    testResults?: { status: string; assertionResults: unknown[] }[];
  };
  // A file that fails to load has no assertions; count it as a failure so it cannot hide.
  const brokenFiles = (report.testResults ?? []).filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  return {
    passed: report.numPassedTests,
    failed: report.numFailedTests + brokenFiles,
    skipped: report.numPendingTests + report.numTodoTests,
  };
}

async function vitestRun(project: string, env: NodeJS.ProcessEnv = {}, shard?: { index: number; count: number }): Promise<Counts> {
  const jsonFile = path.join(resultsDir, shard ? `${project}-${shard.index}.json` : `${project}.json`);
  rmSync(jsonFile, { force: true });
  const args = [
    path.join(repoRoot, 'node_modules/vitest/vitest.mjs'),
    'run',
    '--project',
    project,
    '--reporter=default',
    '--reporter=json',
    `--outputFile.json=${jsonFile}`,
  ];
  if (shard) args.push(`--shard=${shard.index}/${shard.count}`);
  const { code } = await run(process.execPath, args, env);
  const counts = countsFromVitestJson(jsonFile) ?? { passed: 0, failed: 1, skipped: 0 };
  if (code !== 0 && counts.failed === 0) counts.failed = 1; // the runner itself failed
  return counts;
}

async function vitestProject(project: string, env: NodeJS.ProcessEnv = {}): Promise<void> {
  totals[project] = await vitestRun(project, env);
}

/**
 * A project's files in shards that run side by side, each shard with a database of its own (files in one shard run one
 * after another, as they truncate and reseed their database). Much of an API or browser file's time is waiting (bcrypt,
 * a server process starting, PostgreSQL stopping and starting, Chromium rendering in its own processes), so two or
 * three shards fit two cores. Suites themselves run one after another: side by side on two cores they gained nothing
 * (type check beside lint 88 s against 64 s) or starved each other (the unit suite's meshes beside the API's field
 * checks; the component suite beside the browser build).
 */
async function shardedTests(project: 'api' | 'browser', shardCount: number): Promise<void> {
  const shards = Array.from({ length: shardCount }, (_, i) => {
    const db = throwawayDatabase(`${project}${i + 1}`);
    cleanups.push(db.drop);
    return vitestRun(project, { TEST_DATABASE_URL: db.url, TEST_RESULTS_DIR: resultsDir }, { index: i + 1, count: shardCount });
  });
  const counts = await Promise.all(shards);
  totals[project] = counts.reduce(
    (a, c) => ({ passed: a.passed + c.passed, failed: a.failed + c.failed, skipped: a.skipped + c.skipped }),
    {
      passed: 0,
      failed: 0,
      skipped: 0,
    },
  );
}
const API_SHARDS = Math.max(1, Number(process.env['TEST_API_SHARDS'] ?? 3));
const BROWSER_SHARDS = Math.max(1, Number(process.env['TEST_BROWSER_SHARDS'] ?? 2));

// Strict TypeScript over every part of the tree, one check per configuration.
const TYPE_CONFIGS = ['tsconfig.server.json', 'tsconfig.browser-tests.json', 'tsconfig.app.json', 'tsconfig.spec.json'];

async function typeChecks(): Promise<void> {
  const counts = { passed: 0, failed: 0, skipped: 0 };
  for (const config of TYPE_CONFIGS) {
    const { code } = await run(process.execPath, [path.join(repoRoot, 'node_modules/typescript/bin/tsc'), '-p', config, '--noEmit']);
    process.stdout.write(`${code === 0 ? '✓' : '✗'} tsc -p ${config}\n`);
    counts[code === 0 ? 'passed' : 'failed'] += 1;
  }
  totals['types'] = counts;
}

// ESLint (typescript-eslint, angular-eslint) and Prettier's formatting check, one count each.
async function lintChecks(): Promise<void> {
  const counts = { passed: 0, failed: 0, skipped: 0 };
  const checks: [string, string[]][] = [
    ['eslint', [path.join(repoRoot, 'node_modules/eslint/bin/eslint.js'), '.', '--max-warnings=0']],
    ['prettier --check', [path.join(repoRoot, 'node_modules/prettier/bin/prettier.cjs'), '--check', '--log-level=warn', '.']],
  ];
  for (const [name, args] of checks) {
    const { code } = await run(process.execPath, args);
    process.stdout.write(`${code === 0 ? '✓' : '✗'} ${name}\n`);
    counts[code === 0 ? 'passed' : 'failed'] += 1;
  }
  totals['lint'] = counts;
}

async function componentTests(): Promise<void> {
  const { code, output } = await run(
    process.execPath,
    [path.join(repoRoot, 'node_modules/@angular/cli/bin/ng.js'), 'test', '--watch=false'],
    {
      NG_CLI_ANALYTICS: 'false',
    },
  );
  // Strip colour codes, then read vitest's own summary line ("Tests  12 passed (12)").
  // eslint-disable-next-line no-control-regex -- finding control characters is the point of this pattern
  const plain = output.replace(/\u001b\[[0-9;]*m/g, '');
  const line = plain.split('\n').find((l) => /^\s*Tests\s+/.test(l)) ?? '';
  const passed = Number(/(\d+) passed/.exec(line)?.[1] ?? 0);
  const failed = Number(/(\d+) failed/.exec(line)?.[1] ?? 0) || (code !== 0 ? 1 : 0);
  totals['component'] = { passed, failed, skipped: Number(/(\d+) skipped/.exec(line)?.[1] ?? 0) };
}

/**
 * Debian packages the suites drive: Chromium for browser tests, poppler-utils to read and render PDFs, and the solvers
 * the independent checks run (ngspice, gmsh, GetDP; the same list `npm start` installs).
 */
const DEBIAN_TOOLS: DebianTool[] = [
  { binary: '/usr/bin/chromium', pkg: 'chromium' },
  { binary: '/usr/bin/pdftotext', pkg: 'poppler-utils' },
  ...SOLVER_TOOLS,
];

function ensureDebianTools(): void {
  const missing = missingPackages(DEBIAN_TOOLS);
  if (!missing.length) return;
  if (process.getuid?.() !== 0) throw new Error(`Missing test tools: install them with "sudo apt-get install -y ${missing.join(' ')}".`);
  process.stdout.write(`[tools] installing Debian packages: ${missing.join(', ')} (about a minute)…\n`);
  installDebianPackages(missing);
}

/** A fresh database for one suite, dropped afterwards. DATABASE_URL, if set, names the server to use. */
function throwawayDatabase(suite: string): { url: string; drop: () => void } {
  const name = `gapwright_test_${suite}_${Date.now().toString(36)}_${process.pid}`;
  const given = process.env['DATABASE_URL'];
  if (given) {
    const admin = new URL(given);
    const url = new URL(given);
    url.pathname = `/${name}`;
    const psql = (sql: string) => execFileSync('psql', [admin.toString(), '-X', '-q', '-c', sql], { stdio: 'inherit' });
    psql(`create database ${name}`);
    return { url: url.toString(), drop: () => psql(`drop database if exists ${name} with (force)`) };
  }
  const cluster = ensureCluster();
  ensureDatabase(name);
  return { url: cluster.urlFor(name), drop: () => dropDatabase(name) };
}

mkdirSync(resultsDir, { recursive: true });
const started = Date.now();
const cleanups: (() => void)[] = [];
try {
  for (const suite of suites) {
    process.stdout.write(`\n=== ${suite} tests ===\n`);
    const suiteStarted = Date.now();
    if (suite === 'types') await typeChecks();
    if (suite === 'lint') await lintChecks();
    if (suite === 'unit') {
      ensureDebianTools();
      await vitestProject('unit');
    }
    if (suite === 'component') await componentTests();
    if (suite === 'api') {
      ensureDebianTools();
      await shardedTests('api', API_SHARDS);
    }
    if (suite === 'browser') {
      ensureDebianTools();
      ensureClientBuild(repoRoot, 'dist/gapwright/browser/index.html');
      await shardedTests('browser', BROWSER_SHARDS);
    }
    seconds[suite] = (Date.now() - suiteStarted) / 1000;
  }
} finally {
  for (const drop of cleanups) {
    try {
      drop();
    } catch (err) {
      process.stderr.write(`could not drop a test database: ${String(err)}\n`);
    }
  }
}

const sum = Object.values(totals).reduce(
  (a, c) => ({ passed: a.passed + c.passed, failed: a.failed + c.failed, skipped: a.skipped + c.skipped }),
  {
    passed: 0,
    failed: 0,
    skipped: 0,
  },
);
process.stdout.write('\n');
for (const [suite, c] of Object.entries(totals)) {
  const took = seconds[suite] === undefined ? '' : ` (${seconds[suite].toFixed(0)} s)`;
  process.stdout.write(`  ${suite.padEnd(10)} ${c.passed} passed, ${c.failed} failed${c.skipped ? `, ${c.skipped} skipped` : ''}${took}\n`);
}
process.stdout.write(`  (${((Date.now() - started) / 1000).toFixed(0)} s)\n`);
process.stdout.write(`Summary: ${sum.passed} passed, ${sum.failed} failed${sum.skipped ? `, ${sum.skipped} skipped` : ''}\n`);
process.exit(sum.failed > 0 || sum.passed === 0 ? 1 : 0);
