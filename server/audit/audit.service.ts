import type { AuditEntry } from '@shared/schemas/auth';
import type { Tx } from '../db/client.ts';
import type { AuditRecord, AuditRepository } from './audit.repository.ts';

export class AuditService {
  constructor(private readonly repo: AuditRepository) {}

  /** Records an entry; give `tx` when it records a change made in that transaction (both commit or neither). */
  record(entry: AuditRecord, tx?: Tx): Promise<void> {
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
