import { and, asc, desc, eq, getTableColumns, getTableName, inArray, sql } from 'drizzle-orm';
import type { PgColumn, PgTable } from 'drizzle-orm/pg-core';
import type { Db, Tx } from '../db/client.ts';
import { users } from '../db/schema.ts';
import { conflict } from '../http/errors.ts';
import { nameKey } from '../http/name-key.ts';

/** The bookkeeping columns every versioned library table has (materials, user cores). */
export type VersionedTable = PgTable &
  Record<'id' | 'lineage' | 'version' | 'current' | 'retired' | 'name' | 'createdBy' | 'createdAt', PgColumn>;

/** What the library reads of every stored version, whatever else the table holds. */
export interface VersionRow {
  id: number;
  lineage: string;
  version: number;
  current: boolean;
  retired: boolean;
  name: string;
  createdBy: number | null;
  createdAt: Date;
}

export type WithAuthor<Row> = Row & { createdByName: string | null };

/** A version about to be inserted: the item's own columns (`Values`) and where it stands in its lineage. */
export type NewVersion<Values> = Values & { lineage: string; version: number; retired: boolean; createdBy: number | null };

/**
 * Rows of the store's table as its row type. Drizzle types the rows of a table given as a parameter loosely
 * (any column, unknown values); the table a store is built with is the one `Row` is inferred from.
 */
function rowsOf<Row>(rows: unknown[]): Row[] {
  return rows as Row[];
}

const UPDATE_CHUNK = 1000;

/** The queries of one versioned table, typed by its row (`Row`) and its own columns (`Values`). */
export class VersionStore<Row extends VersionRow, Values extends { name: string }> {
  constructor(
    readonly db: Db,
    private readonly table: VersionedTable,
    /** "material", "core": how a refusal names one item. */
    private readonly noun: string,
  ) {}

  /**
   * Waits until no other transaction is adding items to this table, and keeps the others waiting until this one
   * ends. Two writers adding the same name then never both pass the name check, and never both take one new
   * lineage: the second sees the first's commit and hears that the name is taken (409 naming it).
   */
  async lockNewItems(tx: Tx): Promise<void> {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`gapwright.new-items.${getTableName(this.table)}`}))`);
  }

  async findById(id: number, tx: Tx | Db = this.db): Promise<Row | undefined> {
    const [row] = rowsOf<Row>(await tx.select().from(this.table).where(eq(this.table.id, id)));
    return row;
  }

  /** The version with this id, locked until the transaction ends: a parallel writer of it waits, then sees what this one did. */
  async lockById(tx: Tx, id: number): Promise<Row | undefined> {
    const [row] = rowsOf<Row>(await tx.select().from(this.table).where(eq(this.table.id, id)).for('update'));
    return row;
  }

  async listCurrent(includeRetired: boolean, tx: Tx | Db = this.db): Promise<Row[]> {
    const where = includeRetired ? eq(this.table.current, true) : and(eq(this.table.current, true), eq(this.table.retired, false));
    return rowsOf<Row>(await tx.select().from(this.table).where(where).orderBy(asc(this.table.name)));
  }

  /** Current versions (retired ones too) with who created them, by name. */
  listCurrentWithAuthors(): Promise<WithAuthor<Row>[]> {
    return this.withAuthors(eq(this.table.current, true), asc(this.table.name));
  }

  /** Every version of a lineage, newest first, with who created it. */
  history(lineage: string): Promise<WithAuthor<Row>[]> {
    return this.withAuthors(eq(this.table.lineage, lineage), desc(this.table.version));
  }

  private async withAuthors(where: ReturnType<typeof eq>, order: ReturnType<typeof asc>): Promise<WithAuthor<Row>[]> {
    const rows = await this.db
      .select({ row: this.table, createdByName: users.displayName })
      .from(this.table)
      .leftJoin(users, eq(users.id, this.table.createdBy))
      .where(where)
      .orderBy(order);
    return rowsOf<WithAuthor<Row>>(rows.map((r) => ({ ...r.row, createdByName: r.createdByName })));
  }

  /** Current versions (retired ones too) by `nameKey`: a name that is the same name as a stored one finds it. */
  async currentByNameKey(tx: Tx | Db = this.db): Promise<Map<string, Row>> {
    const rows = await this.listCurrent(true, tx);
    return new Map(rows.map((r) => [nameKey(r.name), r]));
  }

  async lineages(tx: Tx): Promise<Set<string>> {
    const rows = await tx.selectDistinct({ lineage: this.table.lineage }).from(this.table);
    return new Set(rows.map((r) => r.lineage as string));
  }

  /**
   * The given versions stop being current (a new version of each is about to be inserted). The update waits
   * for the row lock of a parallel writer and then sees its commit: a version it already replaced is no longer
   * current, and this writer gets a 409 instead of inserting a second version with the same number.
   */
  async supersede(tx: Tx, versionIds: number[]): Promise<void> {
    const ids = [...new Set(versionIds)];
    let superseded = 0;
    for (let i = 0; i < ids.length; i += UPDATE_CHUNK) {
      const chunk = ids.slice(i, i + UPDATE_CHUNK);
      superseded += (
        await tx
          .update(this.table)
          .set({ current: false })
          .where(and(inArray(this.table.id, chunk), eq(this.table.current, true)))
          .returning({ id: this.table.id })
      ).length;
    }
    if (superseded < ids.length) {
      const what = ids.length === 1 ? `this ${this.noun}` : `one of these ${this.noun}s`;
      throw conflict(`Someone else saved a new version of ${what} at the same moment. Reload and make your change again.`);
    }
  }

  /**
   * Many versions in one statement, their ids in the order given. Each column goes as one array parameter
   * through unnest: a 10,000-row import sends a few dozen parameters where a multi-row VALUES insert sends
   * 300,000 in 5 statements and takes five to ten times as long. Columns, their SQL types and value mapping
   * come from the table's Drizzle definition, so nothing here restates a column.
   */
  async insertVersions(tx: Tx, rows: NewVersion<Values>[]): Promise<number[]> {
    if (!rows.length) return [];
    const given = new Set(rows.flatMap((row) => Object.keys(row)));
    const columns = Object.entries(getTableColumns(this.table)).filter(([key]) => given.has(key));
    const arrays = columns.map(([key, column]) => {
      const values = rows.map((row) => {
        const value = (row as Record<string, unknown>)[key];
        return value === undefined || value === null ? null : column.mapToDriverValue(value);
      });
      // The type is the schema's own (varchar(80), double precision, jsonb…), never request text.
      return sql`${sql.param(values)}::${sql.raw(column.getSQLType())}[]`;
    });
    const names = sql.join(
      columns.map(([, column]) => sql.identifier(column.name)),
      sql`, `,
    );
    const result = await tx.execute<{ id: number }>(
      sql`insert into ${this.table} (${names}) select * from unnest(${sql.join(arrays, sql`, `)}) returning ${sql.identifier(this.table.id.name)}`,
    );
    return result.rows.map((r) => r.id);
  }

  async insertVersion(tx: Tx, row: NewVersion<Values>): Promise<Row> {
    const [inserted] = rowsOf<Row>(await tx.insert(this.table).values(row).returning());
    if (!inserted) throw new Error('An insert of one version answered no row.');
    return inserted;
  }

  /** Retires or restores a current version; undefined when `id` is no current version. */
  async setRetired(tx: Tx, id: number, retired: boolean): Promise<Row | undefined> {
    const [row] = rowsOf<Row>(
      await tx
        .update(this.table)
        .set({ retired })
        .where(and(eq(this.table.id, id), eq(this.table.current, true)))
        .returning(),
    );
    return row;
  }
}
