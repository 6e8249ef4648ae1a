import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createApp } from './app.ts';
import type { Config } from './config.ts';
import { createDb } from './db/client.ts';
import { applyMigrations } from './db/migrate.ts';
import { createPool } from './db/pool.ts';
import { createLogger } from './logger.ts';
import { startFakeSmtp } from './mail/fake-smtp.ts';
import { seedDemoOnce } from './seed/seed-demo.ts';

export interface RunningServer {
  server: Server;
  url: string;
  /** Stop accepting, let in-flight requests finish, then close the session store and the pool. */
  stop: () => Promise<void>;
}

export async function startServer(config: Config): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const pool = createPool(config.databaseUrl, config.dbConnectTimeoutMs, logger);
  const db = createDb(pool);
  await applyMigrations(db);
  if (config.seedDemo && (await seedDemoOnce(db, config.bcryptCost))) logger.info('demo scenario seeded');
  // Without a real relay configured, release mails go to a local fake SMTP server (admin outbox).
  const fakeSmtp = config.smtp.host ? undefined : await startFakeSmtp(db, config.smtp.fakePort);
  const mailTarget = config.smtp.host
    ? {
        host: config.smtp.host,
        port: config.smtp.port,
        secure: config.smtp.secure,
        user: config.smtp.user,
        password: config.smtp.password,
        from: config.smtp.from,
      }
    : { host: '127.0.0.1', port: fakeSmtp!.port, secure: false, from: config.smtp.from };
  if (fakeSmtp) logger.info({ port: fakeSmtp.port }, 'local fake SMTP server is capturing mail for the admin outbox');
  const { app, start, close, services } = createApp({ config, pool, db, logger, mailTarget });
  await start();
  services.searchPool.warm();

  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, (err?: Error) => (err ? reject(err) : resolve(s)));
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host}:${port}`;
  logger.info({ url }, 'Gapwright is listening');

  let stopping: Promise<void> | undefined;
  const stop = () =>
    (stopping ??= (async () => {
      await new Promise<void>((resolve) => {
        // Connections that finish their last request while we drain are closed as soon as they go idle.
        const sweep = setInterval(() => server.closeIdleConnections(), 100);
        server.close(() => {
          clearInterval(sweep);
          resolve();
        });
        server.closeIdleConnections();
      });
      await close();
      await fakeSmtp?.close();
      await pool.end();
      logger.info('Gapwright stopped');
    })());
  return { server, url, stop };
}
