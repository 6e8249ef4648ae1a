import { desc, eq } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import type { OutboxResponse } from '@shared/schemas/outbox';
import type { Db } from '../db/client.ts';
import { capturedMail, mailDeliveries } from '../db/schema.ts';
import { notFound } from '../http/errors.ts';

/** What the local fake SMTP server caught, and the state of every delivery the app attempted. */
export class OutboxService {
  constructor(private readonly db: Db) {}

  async list(): Promise<OutboxResponse> {
    const rows = await this.db.select().from(capturedMail).orderBy(desc(capturedMail.receivedAt)).limit(200);
    const messages = await Promise.all(
      rows.map(async (row) => {
        const parsed = await simpleParser(row.raw);
        return {
          id: row.id,
          receivedAt: row.receivedAt.toISOString(),
          from: parsed.from?.text ?? row.envelopeFrom,
          to: row.envelopeTo,
          subject: parsed.subject ?? '(no subject)',
          text: parsed.text ?? '',
          attachments: parsed.attachments.map((a, i) => ({
            index: i + 1,
            fileName: a.filename ?? `attachment-${i + 1}`,
            contentType: a.contentType,
            size: a.size,
          })),
        };
      }),
    );
    const deliveries = await this.db.select().from(mailDeliveries).orderBy(desc(mailDeliveries.createdAt)).limit(200);
    return {
      messages,
      deliveries: deliveries.map((d) => ({ ...d, createdAt: d.createdAt.toISOString(), sentAt: d.sentAt?.toISOString() ?? null })),
    };
  }

  async attachment(messageId: number, index: number) {
    const [row] = await this.db.select().from(capturedMail).where(eq(capturedMail.id, messageId));
    if (!row) throw notFound('No such message.');
    const parsed = await simpleParser(row.raw);
    const attachment = parsed.attachments[index];
    if (!attachment) throw notFound('No such attachment.');
    return { fileName: attachment.filename ?? `attachment-${index + 1}`, contentType: attachment.contentType, content: attachment.content };
  }
}
