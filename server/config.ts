import { availableParallelism } from 'node:os';
import * as z from 'zod';

// The only place that reads process.env: everything else receives a validated Config.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('production'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  DATABASE_URL: z.url({ error: 'DATABASE_URL must be a postgres:// URL' }),
  SESSION_SECRET: z.string().min(32, { error: 'SESSION_SECRET must be at least 32 characters' }),
  COOKIE_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  TRUST_PROXY: z.coerce.number().int().min(0).max(5).default(0),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  STATIC_DIR: z.string().default('dist/gapwright/browser'),
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).default(120),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).default(12),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  DB_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).default(3000),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Gapwright <gapwright@localhost>'),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  JOBS_SCHEMA: z
    .string()
    .regex(/^[a-z_][a-z0-9_]{0,40}$/, { error: 'JOBS_SCHEMA must be a lower-case PostgreSQL name' })
    .default('pgboss'),
  JOBS_POLL_SECONDS: z.coerce.number().min(0.5).default(2),
  // Searches run in worker threads; 0 runs them on the main thread (the behaviour before the pool, kept for comparison).
  SEARCH_WORKERS: z.coerce.number().int().min(0).max(64).optional(),
  SEARCH_QUEUE: z.coerce.number().int().min(0).max(10_000).default(64),
  SEARCH_IDLE_SECONDS: z.coerce.number().min(1).default(60),
  SEARCH_NICE: z.coerce.number().int().min(0).max(19).default(10),
  // Check worker processes `npm start` starts beside the web server (0: none here, workers run elsewhere).
  CHECK_WORKERS: z.coerce.number().int().min(0).max(16).default(1),
  MAIL_RETRY_DELAYS_MS: z
    .string()
    .default('2000,10000,60000,300000')
    .transform((v) => v.split(',').map((n) => Number(n.trim())))
    .refine((list) => list.every((n) => Number.isFinite(n) && n >= 0), {
      error: 'MAIL_RETRY_DELAYS_MS must be comma-separated milliseconds',
    }),
});

export interface Config {
  env: 'development' | 'production' | 'test';
  host: string;
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  cookieSecure: boolean;
  trustProxy: number;
  logLevel: string;
  seedDemo: boolean;
  staticDir: string;
  signInLimit: number;
  signInWindowMs: number;
  sessionIdleMs: number;
  sessionAbsoluteMs: number;
  bcryptCost: number;
  dbConnectTimeoutMs: number;
  /** A real SMTP relay when host is set; otherwise the built-in fake on loopback (development and tests). */
  /** The background job queue (pg-boss): its schema and how often idle workers look for work. */
  jobs: { schema: string; pollSeconds: number };
  /**
   * The engine's worker-thread pool: threads (0 = inline on the main thread), searches allowed to wait beyond those
   * running (one more is refused as busy), how long an idle thread is kept, and how much lower its CPU priority is.
   */
  search: { workers: number; queue: number; idleMs: number; nice: number };
  /** Check worker processes `npm start` starts beside the web server. */
  checkWorkers: number;
  smtp: {
    host?: string;
    port: number;
    secure: boolean;
    user?: string;
    password?: string;
    from: string;
    fakePort: number;
    retryDelaysMs: number[];
  };
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET,
    cookieSecure: e.COOKIE_SECURE,
    trustProxy: e.TRUST_PROXY,
    logLevel: e.LOG_LEVEL,
    seedDemo: e.SEED_DEMO,
    staticDir: e.STATIC_DIR,
    signInLimit: e.SIGN_IN_LIMIT,
    signInWindowMs: e.SIGN_IN_WINDOW_MINUTES * 60_000,
    sessionIdleMs: e.SESSION_IDLE_MINUTES * 60_000,
    sessionAbsoluteMs: e.SESSION_ABSOLUTE_HOURS * 3_600_000,
    bcryptCost: e.BCRYPT_COST,
    dbConnectTimeoutMs: e.DB_CONNECT_TIMEOUT_MS,
    jobs: { schema: e.JOBS_SCHEMA, pollSeconds: e.JOBS_POLL_SECONDS },
    // One core is left to the main thread, which answers every other request while searches run.
    search: {
      workers: e.SEARCH_WORKERS ?? Math.max(1, availableParallelism() - 1),
      queue: e.SEARCH_QUEUE,
      idleMs: e.SEARCH_IDLE_SECONDS * 1000,
      nice: e.SEARCH_NICE,
    },
    checkWorkers: e.CHECK_WORKERS,
    smtp: {
      host: e.SMTP_HOST || undefined,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      user: e.SMTP_USER,
      password: e.SMTP_PASSWORD,
      from: e.MAIL_FROM,
      fakePort: e.FAKE_SMTP_PORT,
      retryDelaysMs: e.MAIL_RETRY_DELAYS_MS,
    },
  };
}

/** What a check worker process needs: the database and the job queue (no session secret, no mail). */
export interface WorkerConfig {
  databaseUrl: string;
  dbConnectTimeoutMs: number;
  logLevel: string;
  jobs: { schema: string; pollSeconds: number };
}

const workerEnvSchema = envSchema.pick({
  DATABASE_URL: true,
  DB_CONNECT_TIMEOUT_MS: true,
  LOG_LEVEL: true,
  JOBS_SCHEMA: true,
  JOBS_POLL_SECONDS: true,
});

export function loadWorkerConfig(env: NodeJS.ProcessEnv = process.env): WorkerConfig {
  const parsed = workerEnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid worker configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    databaseUrl: e.DATABASE_URL,
    dbConnectTimeoutMs: e.DB_CONNECT_TIMEOUT_MS,
    logLevel: e.LOG_LEVEL,
    jobs: { schema: e.JOBS_SCHEMA, pollSeconds: e.JOBS_POLL_SECONDS },
  };
}
