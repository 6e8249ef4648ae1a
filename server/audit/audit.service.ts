import type { AuditEntry } from '@shared/schemas/auth';
import type { Db, Tx } from '../db/client.ts';
import type { AuditRecord, AuditRepository } from './audit.repository.ts';

export class AuditService {
  constructor(private readonly repo: AuditRepository) {}

  /** Give the transaction of the change being recorded: then no change is saved without its entry. */
  record(entry: AuditRecord, tx?: Db | Tx): Promise<void> {
    return this.repo.insert(entry, tx);
  }

  async page(offset: number, limit: number): Promise<{ entries: AuditEntry[]; total: number }> {
    const { rows, total } = await this.repo.page(offset, limit);
    return {
      total,
      entries: rows.map((r) => ({
        id: r.id,
        at: r.at.toISOString(),
        actor: r.actorUsername ?? r.actorName ?? null,
        action: r.action,
        target: r.target,
        details: r.details == null ? null : JSON.stringify(r.details),
      })),
    };
  }
}
