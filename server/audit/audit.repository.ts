import { count, desc, eq } from 'drizzle-orm';
import type { Db, Tx } from '../db/client.ts';
import { auditLog, users } from '../db/schema.ts';

export interface AuditRecord {
  actorId?: number | null;
  actorName?: string | null;
  action: string;
  target?: string | null;
  details?: Record<string, unknown> | null;
  ip?: string | null;
}

export class AuditRepository {
  constructor(private readonly db: Db) {}

  /** Pass the transaction of the change being recorded, so the change and its entry commit or roll back together. */
  async insert(record: AuditRecord, tx: Tx | Db = this.db): Promise<void> {
    await tx.insert(auditLog).values({
      actorId: record.actorId ?? null,
      actorName: record.actorName ?? null,
      action: record.action,
      target: record.target ?? null,
      details: record.details ?? null,
      ip: record.ip ?? null,
    });
  }

  async page(offset: number, limit: number) {
    const rows = await this.db
      .select({
        id: auditLog.id,
        at: auditLog.at,
        actorName: auditLog.actorName,
        actorUsername: users.username,
        action: auditLog.action,
        target: auditLog.target,
        details: auditLog.details,
      })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .orderBy(desc(auditLog.at), desc(auditLog.id))
      .offset(offset)
      .limit(limit);
    const [{ total }] = await this.db.select({ total: count() }).from(auditLog);
    return { rows, total };
  }
}
