import type { FieldErrors } from './errors.ts';

/** What the one error middleware answers for an error PostgreSQL (or the way to it) raised. */
export interface DatabaseAnswer {
  status: number;
  code: string;
  message: string;
  fields?: FieldErrors;
}

interface DriverError extends Error {
  code?: string;
  constraint?: string;
  detail?: string;
}

/** The error itself or one it wraps (Drizzle wraps the driver's as `cause`) that passes `test`. */
function inChain(err: unknown, test: (e: DriverError) => boolean): DriverError | undefined {
  for (let e = err, depth = 0; e instanceof Error && depth < 6; e = e.cause, depth++) {
    if (test(e as DriverError)) return e as DriverError;
  }
  return undefined;
}

// Refused, reset or broken sockets; SQLSTATE class 08 (connection exception); 57P01–57P03 (the server shutting
// down, crashed, or not accepting connections yet). pg's own messages for a client whose connection died: the
// query in hand fails with "Connection terminated unexpectedly", and a rollback sent afterwards (Drizzle does
// that when a transaction fails) with "Client has encountered a connection error and is not queryable".
const SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE']);
const LOST_CONNECTION = /timeout exceeded when trying to connect|Connection terminated|not queryable/i;

// Drizzle's own wrapper is skipped by the message test: its message carries the query's parameters (user text).
const isUnavailable = (e: DriverError) =>
  (e.code !== undefined && (SOCKET_CODES.has(e.code) || /^08/.test(e.code) || /^57P0[1-3]$/.test(e.code))) ||
  (!('query' in e) && LOST_CONNECTION.test(e.message));

/** Whether the error (or one it wraps) says the database cannot be reached just now: worth trying again. */
export function databaseUnavailable(err: unknown): boolean {
  return inChain(err, isUnavailable) !== undefined;
}

/**
 * What each unique index guards, in the words of the screen that writes it. A clash reaching this far means
 * two requests wrote the same thing at the same moment (the services check before writing, but only the
 * index decides between two writers). `value` is the clashing value PostgreSQL reports.
 */
const UNIQUE_CLASHES: Record<string, (value: string) => { message: string; fields?: FieldErrors }> = {
  users_username_unique: (value) => ({ message: `Username "${value}" is taken.`, fields: { username: 'This username is taken' } }),
  materials_current_name_idx: (value) => ({
    message: `Another material is already called "${value}" (saved at the same moment).`,
    fields: { name: 'Name already used' },
  }),
  materials_lineage_version_idx: () => ({
    message: 'Someone else saved a new version of this material at the same moment. Reload it and make your change again.',
  }),
  user_cores_current_name_idx: (value) => ({
    message: `Another user core is already called "${value}" (saved at the same moment).`,
    fields: { name: 'Name already used' },
  }),
  user_cores_lineage_version_idx: () => ({
    message: 'Someone else saved a new version of this core at the same moment. Reload it and make your change again.',
  }),
  design_revisions_design_revision_idx: () => ({
    message: 'Someone else started a new revision of this design at the same moment. Reload the design.',
  }),
  build_orders_revision_id_unique: () => ({ message: 'This revision has already been released to the winding shop.' }),
};

function uniqueClash(e: DriverError): DatabaseAnswer {
  // PostgreSQL's detail: Key (username)=(bob) already exists.
  const value = /=\((.*)\) already exists/.exec(e.detail ?? '')?.[1] ?? '';
  const known = e.constraint ? UNIQUE_CLASHES[e.constraint] : undefined;
  const { message, fields } = known?.(value) ?? { message: 'Someone else saved the same record at the same moment. Reload and try again.' };
  return { status: 409, code: 'conflict', message, ...(fields ? { fields } : {}) };
}

/** 503 for a database that is gone, 409 for two writers colliding; undefined for anything else. */
export function databaseErrorAnswer(err: unknown): DatabaseAnswer | undefined {
  if (inChain(err, isUnavailable)) {
    return { status: 503, code: 'database_unavailable', message: 'The database is not reachable. Try again in a moment.' };
  }
  const unique = inChain(err, (e) => e.code === '23505');
  if (unique) return uniqueClash(unique);
  // Serialization failure and deadlock: PostgreSQL chose this writer to give way to another one.
  if (inChain(err, (e) => e.code === '40001' || e.code === '40P01')) {
    return { status: 409, code: 'conflict', message: 'Someone else changed the same record at the same moment. Reload and try again.' };
  }
  return undefined;
}
