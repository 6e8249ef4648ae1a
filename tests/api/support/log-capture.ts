import { Writable } from 'node:stream';
import pg from 'pg';
import { pino } from 'pino';
import { createApp } from '../../../server/app.ts';
import { createDb } from '../../../server/db/client.ts';
import { testConfig } from './test-app.ts';

/** An app on the suite's database whose every log line (level trace) is kept for the test to read. */
export function createAppCapturingLogs() {
  const captured: string[] = [];
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      captured.push(chunk.toString());
      done();
    },
  });
  const config = testConfig({ LOG_LEVEL: 'trace' });
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 3 });
  const db = createDb(pool);
  const { app, close, services } = createApp({
    config,
    pool,
    db,
    logger: pino({ level: 'trace' }, sink),
    mailTarget: { host: '127.0.0.1', port: 1, secure: false, from: 'x@localhost' },
  });
  return {
    app,
    db,
    config,
    services,
    logText: () => captured.join(''),
    close: async () => {
      await close();
      await pool.end();
    },
  };
}
