import { eq, sql } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Db, Tx } from '../db/client.ts';
import { mailDeliveries } from '../db/schema.ts';
import { retryPolicyOf, type JobQueue, type JobRun } from '../jobs/job-queue.ts';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  attachments: { filename: string; content: Buffer; contentType: string }[];
}

export interface SmtpTarget {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  password?: string;
  from: string;
}

/** A job of one mail kind: which delivery row it is, and the record the message is built from. */
interface MailJob {
  deliveryId: number;
  ref: number;
}

/**
 * Sends the app's e-mails through the job queue. A delivery row and its job are written in the transaction of
 * whatever the mail reports (a release), so neither exists without the other; the job is retried from the queue,
 * across restarts and by any app instance. The row keeps what the admin outbox shows: pending / sent / failed,
 * the attempts made and the last error.
 */
export class MailDeliveryService {
  private readonly transporter: Transporter;

  constructor(
    private readonly db: Db,
    private readonly jobs: JobQueue,
    private readonly target: SmtpTarget,
    private readonly retryDelaysMs: number[],
    private readonly logger: Logger,
  ) {
    this.transporter = nodemailer.createTransport({
      host: target.host,
      port: target.port,
      secure: target.secure,
      ignoreTLS: target.host === '127.0.0.1' && !target.secure,
      connectionTimeout: 5000,
      ...(target.user ? { auth: { user: target.user, pass: target.password ?? '' } } : {}),
    });
  }

  /** Declares a kind of mail: `build` makes the message from the record `ref` when it is sent (and resent). */
  defineKind(kind: string, build: (ref: number) => Promise<OutgoingMail>): void {
    this.jobs.define<MailJob>(`mail.${kind}`, retryPolicyOf(this.retryDelaysMs), (run) => this.attempt(run, build));
  }

  /** Records a pending delivery and its job inside `tx`; returns the delivery id. */
  async queue(tx: Tx, kind: string, delivery: { orderId: number | null; ref: number; to: string; subject: string }): Promise<number> {
    const [row] = await tx
      .insert(mailDeliveries)
      .values({ orderId: delivery.orderId, recipient: delivery.to, subject: delivery.subject })
      .returning({ id: mailDeliveries.id });
    await this.jobs.sendInTransaction(tx, `mail.${kind}`, { deliveryId: row.id, ref: delivery.ref } satisfies MailJob, {
      singletonKey: `delivery:${row.id}`,
    });
    return row.id;
  }

  private async attempt({ data, attempt, lastAttempt }: JobRun<MailJob>, build: (ref: number) => Promise<OutgoingMail>): Promise<void> {
    const id = data.deliveryId;
    const [current] = await this.db.select({ status: mailDeliveries.status }).from(mailDeliveries).where(eq(mailDeliveries.id, id));
    if (!current || current.status === 'sent') return;
    try {
      const mail = await build(data.ref);
      await this.transporter.sendMail({ from: this.target.from, ...mail });
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      this.logger.warn({ delivery: id, attempt, err: message }, 'mail delivery failed');
      await this.db
        .update(mailDeliveries)
        .set({
          attempts: sql`${mailDeliveries.attempts} + 1`,
          lastError: message.slice(0, 500),
          ...(lastAttempt ? { status: 'failed' as const } : {}),
        })
        .where(eq(mailDeliveries.id, id));
      throw err; // the queue retries it (or records it failed after the last attempt)
    }
    await this.db
      .update(mailDeliveries)
      .set({ status: 'sent', sentAt: new Date(), attempts: sql`${mailDeliveries.attempts} + 1`, lastError: null })
      .where(eq(mailDeliveries.id, id));
  }

  close(): void {
    this.transporter.close();
  }
}
