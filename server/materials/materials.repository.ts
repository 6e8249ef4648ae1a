import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { materials } from '../db/schema.ts';

export type MaterialRow = typeof materials.$inferSelect;

export class MaterialsRepository {
  constructor(private readonly db: Db) {}

  listCurrent(includeRetired = false): Promise<MaterialRow[]> {
    const where = includeRetired ? eq(materials.current, true) : and(eq(materials.current, true), eq(materials.retired, false));
    return this.db.select().from(materials).where(where).orderBy(asc(materials.name));
  }

  findByIds(ids: number[]): Promise<MaterialRow[]> {
    if (!ids.length) return Promise.resolve([]);
    return this.db.select().from(materials).where(inArray(materials.id, ids));
  }
}
