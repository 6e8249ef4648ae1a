import type { AuditEntry } from '@shared/schemas/auth';
import type { AuditRecord, AuditRepository } from './audit.repository.ts';

export class AuditService {
  constructor(private readonly repo: AuditRepository) {}

  record(entry: AuditRecord): Promise<void> {
    return this.repo.insert(entry);
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
