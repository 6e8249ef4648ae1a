import { describe, expect, it } from 'vitest';
import { databaseErrorAnswer } from '../../../server/http/database-errors.ts';

// Shaped like what pg raises and how Drizzle wraps it (DrizzleQueryError: the query and its parameters, the
// driver's error as `cause`).
function driverError(message: string, extra: Record<string, unknown> = {}): Error {
  return Object.assign(new Error(message), extra);
}
function wrapped(cause: Error, params: unknown[] = []): Error {
  return Object.assign(new Error(`Failed query: insert into "designs" ...\nparams: ${params.join(',')}`, { cause }), {
    query: 'insert ...',
    params,
  });
}

describe('errors from PostgreSQL in the one error shape', () => {
  it('answers 503 for a database that went away, however the loss shows', () => {
    const losses = [
      driverError('terminating connection due to administrator command', { code: '57P01' }),
      driverError('the database system is shutting down', { code: '57P03' }),
      driverError('connect ECONNREFUSED 127.0.0.1:5432', { code: 'ECONNREFUSED' }),
      driverError('read ECONNRESET', { code: 'ECONNRESET' }),
      driverError('write EPIPE', { code: 'EPIPE' }),
      driverError('could not receive data from server', { code: '08006' }),
      driverError('Connection terminated unexpectedly'),
      driverError('timeout exceeded when trying to connect'),
      // What Drizzle's rollback meets on a client whose connection has died under the transaction.
      wrapped(driverError('Client has encountered a connection error and is not queryable')),
    ];
    for (const err of losses) {
      expect(databaseErrorAnswer(err), err.message).toMatchObject({ status: 503, code: 'database_unavailable' });
    }
  });

  it('does not take user text inside a failed query for a lost connection', () => {
    const err = wrapped(driverError('value too long for type character varying(120)', { code: '22001' }), [
      'Connection terminated unexpectedly',
    ]);
    expect(databaseErrorAnswer(err)).toBeUndefined();
  });

  it('answers 409 naming what clashed for a unique violation', () => {
    const username = wrapped(
      driverError('duplicate key value violates unique constraint "users_username_unique"', {
        code: '23505',
        constraint: 'users_username_unique',
        detail: 'Key (username)=(quinn) already exists.',
      }),
    );
    expect(databaseErrorAnswer(username)).toEqual({
      status: 409,
      code: 'conflict',
      message: 'Username "quinn" is taken.',
      fields: { username: 'This username is taken' },
    });
    const version = driverError('duplicate key', {
      code: '23505',
      constraint: 'materials_lineage_version_idx',
      detail: 'Key (lineage, version)=(mf-95, 2) already exists.',
    });
    expect(databaseErrorAnswer(version)).toMatchObject({ status: 409, message: expect.stringMatching(/new version of this material/) });
    const coreName = driverError('duplicate key', {
      code: '23505',
      constraint: 'user_cores_current_name_idx',
      detail: 'Key (lower(name::text))=(lab ring) already exists.',
    });
    expect(databaseErrorAnswer(coreName)).toMatchObject({
      status: 409,
      message: 'Another user core is already called "lab ring" (saved at the same moment).',
      fields: { name: 'Name already used' },
    });
    const unknown = driverError('duplicate key', { code: '23505', constraint: 'some_future_idx' });
    expect(databaseErrorAnswer(unknown)).toMatchObject({ status: 409, code: 'conflict' });
  });

  it('answers 409 when PostgreSQL makes a writer give way (serialization failure, deadlock)', () => {
    expect(databaseErrorAnswer(driverError('could not serialize access', { code: '40001' }))).toMatchObject({ status: 409 });
    expect(databaseErrorAnswer(driverError('deadlock detected', { code: '40P01' }))).toMatchObject({ status: 409 });
  });

  it('leaves every other error to the middleware', () => {
    expect(databaseErrorAnswer(new Error('boom'))).toBeUndefined();
    expect(databaseErrorAnswer(driverError('syntax error', { code: '42601' }))).toBeUndefined();
    expect(databaseErrorAnswer('not an error')).toBeUndefined();
  });
});
