import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client.ts';
import { capturedMail } from '../db/schema.ts';

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export interface FakeSmtp {
  port: number;
  close: () => Promise<void>;
}

/**
 * A local SMTP server for development and tests: accepts any message on loopback and stores it
 * for the admin outbox. It is never exposed beyond 127.0.0.1.
 */
export async function startFakeSmtp(db: Db, port = 0): Promise<FakeSmtp> {
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Gapwright local test mail server',
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        db.insert(capturedMail)
          .values({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: session.envelope.rcptTo.map((r) => r.address).join(', '),
            raw: Buffer.concat(chunks).toString('utf8'),
          })
          .then(
            () => callback(),
            (err: Error) => callback(err),
          );
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return { port: address.port, close: () => new Promise((resolve) => server.close(() => resolve())) };
}
