import { appendFileSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { ensureCluster, ensureDatabase, stopCluster, type ClusterLocation } from '../../server/ops/postgres.ts';
import { DEMO_DESIGNS } from '../../server/seed/demo-designs.ts';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { startServerProcess, type ServerProcess } from './server-process.ts';
import { SessionClient, type Answer } from './session-client.ts';

// PostgreSQL stopped in fast mode under write load, then started again, against the real server in its own
// process: the API test runs a few of these trials, `npm run bench` runs twenty and counts the crashes.

const DATABASE = 'gapwright_outage_trial';
const EXPECTED = new Set([200, 201, 503]);

export interface OutageTrialResult {
  /** The server process ended during the trial (the failure this rig exists to catch). */
  crashed: boolean;
  /** What the server wrote to stderr when it crashed. */
  crashOutput: string;
  /** Answers by status; network failures are counted under 0. */
  statuses: Record<number, number>;
  /** A few answers other than 200/201/503, described. */
  unexpected: string[];
  /** Writes succeeded again after PostgreSQL came back, without restarting the server. */
  recovered: boolean;
  /** Designs with no revision, and recorded units with no audit entry: half-written work. */
  designsWithoutRevision: number;
  unitsWithoutAudit: number;
}

interface Measurement {
  inductance: number;
  testFrequency: number;
  resistance: number;
  resistanceTemperature: number;
  hipot: 'not_tested';
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * A throwaway cluster (its own root and port; the shared cluster is never stopped) holding the demo scenario
 * and one released build order big enough to take every unit the trials record.
 */
export class OutageRig {
  private constructor(
    private readonly location: ClusterLocation,
    private readonly dataDir: string,
    private readonly databaseUrl: string,
    private readonly engineer: SessionClient,
    private readonly winder: SessionClient,
    private readonly orderId: number,
    private readonly unit: Measurement,
  ) {}

  static async create(name: string): Promise<OutageRig> {
    const location: ClusterLocation = { root: `/tmp/gapwright-${name}-${process.pid}`, port: 55000 + (process.pid % 900) };
    const cluster = ensureCluster(location);
    // A throwaway cluster need not survive a power cut: without fsync its shutdown checkpoint, and so each
    // trial, takes a fraction of the time (read at the first restart).
    appendFileSync(path.join(cluster.dataDir, 'postgresql.auto.conf'), 'fsync = off\nsynchronous_commit = off\nfull_page_writes = off\n');
    const databaseUrl = cluster.urlFor(DATABASE);
    ensureDatabase(DATABASE, location);
    // The first start migrates and seeds; the clients' sessions live in PostgreSQL and serve every trial.
    const server = await startOutageServer(databaseUrl);
    try {
      const [engineer, reviewer, winder] = await Promise.all(
        (['engineer', 'reviewer', 'winder'] as const).map(async (role) => {
          const user = DEMO_USERS.find((u) => u.role === role)!;
          return SessionClient.signIn(server.baseUrl, user.username, user.password);
        }),
      );
      const revisionId = await firstDraftRevision(databaseUrl);
      await engineer.expectOk('POST', `/api/revisions/${revisionId}/submit`, {});
      await reviewer.expectOk('POST', `/api/revisions/${revisionId}/approve`, {});
      const released = (await reviewer.expectOk('POST', `/api/revisions/${revisionId}/release`, { quantity: 100000 })) as {
        orderId: number;
      };
      const order = (await winder.expectOk('GET', `/api/shop/orders/${released.orderId}`)) as {
        sheet: { tests: { inductance: { nominal: number; testFrequency: number } }; predicted: { resistance20: number } };
      };
      const unit: Measurement = {
        inductance: order.sheet.tests.inductance.nominal,
        testFrequency: order.sheet.tests.inductance.testFrequency,
        resistance: order.sheet.predicted.resistance20,
        resistanceTemperature: 20,
        hipot: 'not_tested',
      };
      return new OutageRig(location, cluster.dataDir, databaseUrl, engineer, winder, released.orderId, unit);
    } finally {
      await stopServer(server);
    }
  }

  private server: ServerProcess | undefined;

  /**
   * One trial: `loops` request loops writing, PostgreSQL stopped (fast) and started under them. The server
   * carries on from the previous trial when it survived it (recovering without a restart, again and again);
   * a fresh one replaces a crashed one.
   */
  async trial(loops: number, { loadBeforeStopMs = 500 } = {}): Promise<OutageTrialResult> {
    if (!this.server || !isAlive(this.server)) this.server = await startOutageServer(this.databaseUrl);
    const server = this.server;
    const engineer = this.engineer.at(server.baseUrl);
    const winder = this.winder.at(server.baseUrl);
    const statuses: Record<number, number> = {};
    const unexpected: string[] = [];
    const alive = () => isAlive(server);
    let loading = true;
    let n = 0;

    const write = (i: number) =>
      i % 2 === 0
        ? engineer.send('POST', '/api/designs', { title: `Outage trial design ${++n}`, spec: DEMO_DESIGNS[1].spec })
        : winder.send('POST', `/api/shop/orders/${this.orderId}/units`, this.unit);
    const tally = async (answer: Promise<Answer>) => {
      const { status, text } = await answer;
      statuses[status] = (statuses[status] ?? 0) + 1;
      if (!EXPECTED.has(status) && unexpected.length < 5) unexpected.push(`${status} ${text.slice(0, 200)}`);
      if (status === 0) await pause(50); // no server: do not spin
      return status;
    };
    const running = Array.from({ length: loops }, async (_, i) => {
      while (loading && alive()) await tally(write(i));
    });

    await pause(loadBeforeStopMs);
    await stopFast(this.dataDir);
    await pause(200); // the loops meet the stopped database
    ensureCluster(this.location);

    let recovered = false;
    for (let i = 0; i < 100 && !recovered && alive(); i++) {
      recovered =
        (await tally(engineer.send('POST', '/api/designs', { title: 'Outage trial: after the restart', spec: DEMO_DESIGNS[0].spec }))) ===
        201;
      if (!recovered) await pause(100);
    }
    await pause(200); // and the loops write again
    loading = false;
    await Promise.all(running);
    const crashed = !alive();
    if (crashed) await server.exited;
    const crashOutput = crashed ? server.stderrTail() : '';
    return { crashed, crashOutput, statuses, unexpected, recovered, ...(await this.halfWritten()) };
  }

  private async halfWritten(): Promise<Pick<OutageTrialResult, 'designsWithoutRevision' | 'unitsWithoutAudit'>> {
    const client = new pg.Client({ connectionString: this.databaseUrl });
    await client.connect();
    try {
      const designs = await client.query<{ n: number }>(
        'select count(*)::int as n from designs d where not exists (select 1 from design_revisions r where r.design_id = d.id)',
      );
      const units = await client.query<{ n: number }>(
        `select count(*)::int as n from build_units u join build_orders o on o.id = u.order_id
         where not exists (select 1 from audit_log a where a.action = 'shop.unit_recorded' and a.target = o.number || ' unit ' || u.unit_number)`,
      );
      return { designsWithoutRevision: designs.rows[0].n, unitsWithoutAudit: units.rows[0].n };
    } finally {
      await client.end();
    }
  }

  async close(): Promise<void> {
    if (this.server) await stopServer(this.server);
    stopCluster(this.location, 'immediate');
    rmSync(this.location.root!, { recursive: true, force: true });
  }
}

/**
 * What `pg_ctl stop -m fast` does (SIGINT to the postmaster: every session terminated with 57P01, then a
 * shutdown), without blocking this process, so the request loops keep writing while PostgreSQL goes away.
 */
async function stopFast(dataDir: string): Promise<void> {
  const pid = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
  process.kill(pid, 'SIGINT');
  const running = () => {
    try {
      process.kill(pid, 0);
      return true;
    } catch (err) {
      return (err as NodeJS.ErrnoException).code === 'EPERM';
    }
  };
  while (running()) await pause(20);
}

function startOutageServer(databaseUrl: string): Promise<ServerProcess> {
  // A short connection timeout keeps requests during the outage quick; cost 4 keeps the demo sign-ins quick.
  return startServerProcess(databaseUrl, { DB_CONNECT_TIMEOUT_MS: '1000', BCRYPT_COST: '4' });
}

const isAlive = (server: ServerProcess) => server.child.exitCode === null && server.child.signalCode === null;

async function stopServer(server: ServerProcess): Promise<void> {
  if (!isAlive(server)) return;
  server.child.kill('SIGKILL');
  await server.exited;
}

async function firstDraftRevision(databaseUrl: string): Promise<number> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ id: number }>(
      "select r.id from design_revisions r where r.status = 'draft' and r.result is not null order by r.id limit 1",
    );
    if (!rows[0]) throw new Error('the demo scenario has no evaluated draft revision to release');
    return rows[0].id;
  } finally {
    await client.end();
  }
}
