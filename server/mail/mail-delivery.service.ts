import { eq, sql } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Db } from '../db/client.ts';
import { mailDeliveries } from '../db/schema.ts';

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

/**
 * Sends the app's e-mails with retries. A delivery is recorded first and sent afterwards, so a
 * failing mail server never blocks or undoes what triggered the mail (a release).
 */
export class MailDeliveryService {
  private readonly transporter: Transporter;
  private readonly timers = new Set<NodeJS.Timeout>();
  private closed = false;

  constructor(
    private readonly db: Db,
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

  /** Records the delivery and starts sending it in the background; `build` makes the message when sent. */
  async queue(orderId: number | null, to: string, subject: string, build: () => Promise<OutgoingMail>): Promise<number> {
    const [row] = await this.db.insert(mailDeliveries).values({ orderId, recipient: to, subject }).returning({ id: mailDeliveries.id });
    void this.attempt(row.id, build);
    return row.id;
  }

  private async attempt(id: number, build: () => Promise<OutgoingMail>): Promise<void> {
    if (this.closed) return;
    try {
      const mail = await build();
      await this.transporter.sendMail({ from: this.target.from, ...mail });
      await this.db.update(mailDeliveries).set({ status: 'sent', sentAt: new Date(), attempts: sql`${mailDeliveries.attempts} + 1`, lastError: null }).where(eq(mailDeliveries.id, id));
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      const [row] = await this.db
        .update(mailDeliveries)
        .set({ attempts: sql`${mailDeliveries.attempts} + 1`, lastError: message.slice(0, 500) })
        .where(eq(mailDeliveries.id, id))
        .returning({ attempts: mailDeliveries.attempts })
        .catch(() => [] as { attempts: number }[]);
      const attempts = row?.attempts ?? this.retryDelaysMs.length + 1;
      const delay = this.retryDelaysMs[attempts - 1];
      this.logger.warn({ delivery: id, attempts, err: message }, 'mail delivery failed');
      if (delay === undefined || this.closed) {
        await this.db.update(mailDeliveries).set({ status: 'failed' }).where(eq(mailDeliveries.id, id)).catch(() => undefined);
        return;
      }
      const timer = setTimeout(() => {
        this.timers.delete(timer);
        void this.attempt(id, build);
      }, delay);
      timer.unref();
      this.timers.add(timer);
    }
  }

  close(): void {
    this.closed = true;
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    this.transporter.close();
  }
}
