import { and, asc, desc, eq, inArray, type SQL } from 'drizzle-orm';
import type { MaterialValues } from '@shared/schemas/material-values';
import type { Db, Tx } from '../db/client.ts';
import { materialImports, materials, users } from '../db/schema.ts';
import { VersionStore } from '../library/version-store.ts';

export type MaterialRow = typeof materials.$inferSelect;
export type MaterialImportRow = typeof materialImports.$inferSelect;

/** The materials other features read (searches, designs, comparisons) and the log of material uploads. */
export class MaterialsRepository {
  /** The versioned library's queries on the materials table. */
  readonly versions: VersionStore<MaterialRow, MaterialValues>;
  // The current versions by name, prepared once: the list is read on most pages.
  private readonly currentInUse;
  private readonly currentWithRetired;

  constructor(readonly db: Db) {
    this.versions = new VersionStore(db, materials, 'material');
    const current = (where: SQL | undefined, name: string) =>
      db.select().from(materials).where(where).orderBy(asc(materials.name)).prepare(name);
    this.currentInUse = current(and(eq(materials.current, true), eq(materials.retired, false)), 'materials_current');
    this.currentWithRetired = current(eq(materials.current, true), 'materials_current_with_retired');
  }

  listCurrent(includeRetired = false): Promise<MaterialRow[]> {
    return (includeRetired ? this.currentWithRetired : this.currentInUse).execute();
  }

  findByIds(ids: number[]): Promise<MaterialRow[]> {
    if (!ids.length) return Promise.resolve([]);
    return this.db.select().from(materials).where(inArray(materials.id, ids));
  }

  async insertImport(tx: Tx, values: Omit<typeof materialImports.$inferInsert, 'id' | 'uploadedAt'>): Promise<MaterialImportRow> {
    const [row] = await tx.insert(materialImports).values(values).returning();
    return row!;
  }

  async listImports(limit = 100) {
    return this.db
      .select({ entry: materialImports, uploadedByName: users.displayName })
      .from(materialImports)
      .leftJoin(users, eq(users.id, materialImports.uploadedBy))
      .orderBy(desc(materialImports.uploadedAt), desc(materialImports.id))
      .limit(limit);
  }
}
