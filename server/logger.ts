import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino(
    {
      level,
      // Never let a password, a session secret or a token reach the logs.
      redact: { paths: ['password', '*.password', 'newPassword', 'currentPassword', 'sessionSecret', 'databaseUrl'], censor: '[redacted]' },
    },
    // Written asynchronously: lines that come while a write is under way go out together in the next one, instead of
    // one blocking write per request. pino flushes what is left when the process exits.
    pino.destination({ dest: 1, sync: false }),
  );
}
