import { pino, stdSerializers, type DestinationStream, type Logger } from 'pino';

const VALUES_IN_TEXT = /\nparams: [\s\S]*?(?=\n\s+at |$)/;

/**
 * An error as it may be logged: the SQL text stays, the values bound to it do not (Drizzle puts them in
 * `params` and in its message; PostgreSQL's `detail` repeats key values). One held a bcrypt hash.
 */
export function withoutQueryValues(err: unknown, depth = 0): unknown {
  if (!(err instanceof Error) || depth > 5) return err;
  const copy = Object.assign(Object.create(Object.getPrototypeOf(err) as object) as Error, err) as Error & Record<string, unknown>;
  copy.message = err.message.replace(VALUES_IN_TEXT, '');
  copy.stack = err.stack?.replace(VALUES_IN_TEXT, '');
  delete copy['params'];
  delete copy['detail'];
  if (err.cause !== undefined) copy.cause = withoutQueryValues(err.cause, depth + 1);
  return copy;
}

export const logSerializers = { err: (err: Error) => stdSerializers.err(withoutQueryValues(err) as Error) };

export function createLogger(level: string, destination?: DestinationStream): Logger {
  return pino(
    {
      level,
      serializers: logSerializers,
      // Never let a password, a session secret or a token reach the logs.
      redact: { paths: ['password', '*.password', 'newPassword', 'currentPassword', 'sessionSecret', 'databaseUrl'], censor: '[redacted]' },
    },
    // Written asynchronously unless a destination is given: lines that come while a write is under way go out
    // together in the next one, instead of one blocking write per request. pino flushes what is left at exit.
    destination ?? pino.destination({ dest: 1, sync: false }),
  );
}
