import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { MaterialValues } from '@shared/schemas/materials';
import type { Db } from '../db/client.ts';
import { materialImports, materials, users } from '../db/schema.ts';

export type MaterialRow = typeof materials.$inferSelect;
export type MaterialImportRow = typeof materialImports.$inferSelect;
/** A transaction handle or the database itself. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0] | Db;

export interface MaterialWithAuthor extends MaterialRow {
  createdByName: string | null;
}

const INSERT_CHUNK = 1000;

export class MaterialsRepository {
  constructor(readonly db: Db) {}

  listCurrent(includeRetired = false): Promise<MaterialRow[]> {
    const where = includeRetired ? eq(materials.current, true) : and(eq(materials.current, true), eq(materials.retired, false));
    return this.db.select().from(materials).where(where).orderBy(asc(materials.name));
  }

  findByIds(ids: number[]): Promise<MaterialRow[]> {
    if (!ids.length) return Promise.resolve([]);
    return this.db.select().from(materials).where(inArray(materials.id, ids));
  }

  async findById(id: number): Promise<MaterialRow | undefined> {
    const [row] = await this.db.select().from(materials).where(eq(materials.id, id));
    return row;
  }

  /** Current versions (retired too) with who created them. */
  async listWithAuthors(): Promise<MaterialWithAuthor[]> {
    const rows = await this.db
      .select({ material: materials, createdByName: users.displayName })
      .from(materials)
      .leftJoin(users, eq(users.id, materials.createdBy))
      .where(eq(materials.current, true))
      .orderBy(asc(materials.name));
    return rows.map((r) => ({ ...r.material, createdByName: r.createdByName }));
  }

  async history(lineage: string): Promise<MaterialWithAuthor[]> {
    const rows = await this.db
      .select({ material: materials, createdByName: users.displayName })
      .from(materials)
      .leftJoin(users, eq(users.id, materials.createdBy))
      .where(eq(materials.lineage, lineage))
      .orderBy(desc(materials.version));
    return rows.map((r) => ({ ...r.material, createdByName: r.createdByName }));
  }

  /** Current versions by lower-cased name. */
  async currentByLowerName(tx: Tx = this.db): Promise<Map<string, MaterialRow>> {
    const rows = await tx.select().from(materials).where(eq(materials.current, true));
    return new Map(rows.map((r) => [r.name.toLowerCase(), r]));
  }

  async lineages(tx: Tx = this.db): Promise<Set<string>> {
    const rows = await tx.selectDistinct({ lineage: materials.lineage }).from(materials);
    return new Set(rows.map((r) => r.lineage));
  }

  async retireCurrentVersions(tx: Tx, ids: number[]): Promise<void> {
    for (let i = 0; i < ids.length; i += INSERT_CHUNK) {
      await tx.update(materials).set({ current: false }).where(inArray(materials.id, ids.slice(i, i + INSERT_CHUNK)));
    }
  }

  async insertVersions(
    tx: Tx,
    rows: (MaterialValues & { lineage: string; version: number; retired?: boolean; importId: number | null; createdBy: number | null })[],
  ): Promise<MaterialRow[]> {
    const inserted: MaterialRow[] = [];
    for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
      inserted.push(...(await tx.insert(materials).values(rows.slice(i, i + INSERT_CHUNK)).returning()));
    }
    return inserted;
  }

  async setRetired(id: number, retired: boolean): Promise<MaterialRow | undefined> {
    const [row] = await this.db.update(materials).set({ retired }).where(and(eq(materials.id, id), eq(materials.current, true))).returning();
    return row;
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

  async count(): Promise<number> {
    const [row] = await this.db.select({ n: sql<number>`count(*)::int` }).from(materials);
    return row?.n ?? 0;
  }
}
