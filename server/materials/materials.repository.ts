import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { MaterialValues } from '@shared/schemas/materials';
import type { Db } from '../db/client.ts';
import { conflict } from '../http/errors.ts';
import { materialImports, materials, users } from '../db/schema.ts';

export type MaterialRow = typeof materials.$inferSelect;
export type MaterialImportRow = typeof materialImports.$inferSelect;
/** A transaction handle or the database itself. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0] | Db;

export type NewMaterialVersion = MaterialValues & {
  lineage: string;
  version: number;
  retired?: boolean;
  importId: number | null;
  createdBy: number | null;
};

export interface MaterialWithAuthor extends MaterialRow {
  createdByName: string | null;
}

const UPDATE_CHUNK = 1000;

export class MaterialsRepository {
  // The current versions by name, prepared once: the list is read on most pages.
  private readonly currentInUse;
  private readonly currentWithRetired;

  constructor(readonly db: Db) {
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

  async findById(id: number, tx: Tx = this.db): Promise<MaterialRow | undefined> {
    const [row] = await tx.select().from(materials).where(eq(materials.id, id));
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

  /**
   * The given versions stop being current (a new version of each is about to be inserted). The update waits
   * for the row lock of a parallel writer and then sees its commit: a version it already replaced is no longer
   * current, and this writer gets a 409 instead of inserting a second version with the same number.
   */
  async retireCurrentVersions(tx: Tx, versionIds: number[]): Promise<void> {
    const ids = [...new Set(versionIds)];
    let retired = 0;
    for (let i = 0; i < ids.length; i += UPDATE_CHUNK) {
      const chunk = ids.slice(i, i + UPDATE_CHUNK);
      retired += (
        await tx
          .update(materials)
          .set({ current: false })
          .where(and(inArray(materials.id, chunk), eq(materials.current, true)))
          .returning({ id: materials.id })
      ).length;
    }
    if (retired < ids.length) {
      const what = ids.length === 1 ? 'this material' : 'one of these materials';
      throw conflict(`Someone else saved a new version of ${what} at the same moment. Reload and make your change again.`);
    }
  }

  /**
   * Many versions in one statement: each column goes as one array parameter through unnest, which keeps
   * a 10,000-row import to a few parameters instead of hundreds of thousands.
   */
  async insertVersions(tx: Tx, rows: NewMaterialVersion[]): Promise<number[]> {
    if (!rows.length) return [];
    const column = <K extends keyof NewMaterialVersion>(key: K) => rows.map((r) => r[key] ?? null);
    const result = await tx.execute(sql`
      insert into materials (lineage, version, retired, name, family, unit_set, k_uploaded, k, alpha, beta,
        fit_frequency_min, fit_frequency_max, fit_flux_min, fit_flux_max, ct0, ct1, ct2, reference_temperature,
        bsat_25, bsat_100, permeability, roll_off_a, roll_off_b, roll_off_c, density, provenance, import_id, created_by)
      select * from unnest(
        ${sql.param(column('lineage'))}::varchar[], ${sql.param(column('version'))}::int[], ${sql.param(rows.map((r) => r.retired ?? false))}::boolean[],
        ${sql.param(column('name'))}::varchar[], ${sql.param(column('family'))}::varchar[], ${sql.param(column('unitSet'))}::varchar[],
        ${sql.param(column('kUploaded'))}::float8[], ${sql.param(column('k'))}::float8[], ${sql.param(column('alpha'))}::float8[], ${sql.param(column('beta'))}::float8[],
        ${sql.param(column('fitFrequencyMin'))}::float8[], ${sql.param(column('fitFrequencyMax'))}::float8[], ${sql.param(column('fitFluxMin'))}::float8[],
        ${sql.param(column('fitFluxMax'))}::float8[], ${sql.param(column('ct0'))}::float8[], ${sql.param(column('ct1'))}::float8[], ${sql.param(column('ct2'))}::float8[],
        ${sql.param(column('referenceTemperature'))}::float8[], ${sql.param(column('bsat25'))}::float8[], ${sql.param(column('bsat100'))}::float8[],
        ${sql.param(column('permeability'))}::float8[], ${sql.param(column('rollOffA'))}::float8[], ${sql.param(column('rollOffB'))}::float8[],
        ${sql.param(column('rollOffC'))}::float8[], ${sql.param(column('density'))}::float8[], ${sql.param(column('provenance'))}::text[],
        ${sql.param(column('importId'))}::int[], ${sql.param(column('createdBy'))}::int[]
      )
      returning id`);
    return (result.rows as { id: number }[]).map((r) => r.id);
  }

  async setRetired(id: number, retired: boolean, db: Tx | Db = this.db): Promise<MaterialRow | undefined> {
    const [row] = await db
      .update(materials)
      .set({ retired })
      .where(and(eq(materials.id, id), eq(materials.current, true)))
      .returning();
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
