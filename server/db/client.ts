import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import type pg from 'pg';
import * as schema from './schema.ts';

export type Db = NodePgDatabase<typeof schema>;

export function createDb(pool: pg.Pool): Db {
  return drizzle({ client: pool, schema });
}

/** The handle a `db.transaction(async (tx) => …)` callback receives. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
