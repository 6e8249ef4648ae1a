import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino({
    level,
    // Never let a password, a session secret or a token reach the logs.
    redact: { paths: ['password', '*.password', 'newPassword', 'currentPassword', 'sessionSecret', 'databaseUrl'], censor: '[redacted]' },
  });
}
