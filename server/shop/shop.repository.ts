import { and, asc, count, desc, eq, sql } from 'drizzle-orm';
import * as z from 'zod';
import { unitFindingSchema } from '@shared/schemas/shop';
import { windingSheetSchema } from '@shared/schemas/winding-sheet';
import type { UnitFinding } from '@shared/shop/measurement';
import type { WindingSheet } from '@shared/shop/sheet';
import type { Db, Tx } from '../db/client.ts';
import { appSettings, buildOrders, buildUnits, designRevisions, designs, users } from '../db/schema.ts';

type OrderRow = typeof buildOrders.$inferSelect;
type UnitRow = typeof buildUnits.$inferSelect;
/** A build order with its frozen sheet read back through the sheet's schema. */
export type StoredOrder = Omit<OrderRow, 'sheet'> & { sheet: WindingSheet };
export type StoredUnit = Omit<UnitRow, 'findings'> & { findings: UnitFinding[] };

const findingsSchema = z.array(unitFindingSchema);

/**
 * Stored JSON read back with its schema. The app wrote it, so a mismatch is a fault of ours (a 500 naming
 * the column), not bad input.
 */
function stored<T>(schema: z.ZodType<T>, value: unknown, what: string): T {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw new Error(`stored ${what} does not match its schema: ${parsed.error.message}`);
  return parsed.data;
}

const storedSheet = (value: unknown): WindingSheet => stored(windingSheetSchema, value, 'winding sheet');
const storedOrder = (row: OrderRow): StoredOrder => ({ ...row, sheet: storedSheet(row.sheet) });
const storedUnit = (row: UnitRow): StoredUnit => ({ ...row, findings: stored(findingsSchema, row.findings, 'unit findings') });

export class ShopRepository {
  constructor(readonly db: Db) {}

  async nextOrderNumber(tx: Tx): Promise<string> {
    const [{ n }] = await tx.select({ n: sql<number>`coalesce(max(${buildOrders.id}), 0)::int + 1` }).from(buildOrders);
    return `BO-${String(n).padStart(4, '0')}`;
  }

  async insertOrder(tx: Tx, order: typeof buildOrders.$inferInsert & { sheet: WindingSheet }): Promise<StoredOrder> {
    const [row] = await tx.insert(buildOrders).values(order).returning();
    return { ...row, sheet: order.sheet };
  }

  async userName(tx: Tx, id: number | null): Promise<string> {
    if (id == null) return 'unknown';
    const [row] = await tx.select({ name: users.displayName }).from(users).where(eq(users.id, id));
    return row?.name ?? 'unknown';
  }

  orders(status?: 'open' | 'complete') {
    return this.db
      .select({
        id: buildOrders.id,
        number: buildOrders.number,
        quantity: buildOrders.quantity,
        status: buildOrders.status,
        createdAt: buildOrders.createdAt,
        completedAt: buildOrders.completedAt,
        revisionId: designRevisions.id,
        revision: designRevisions.revision,
        designId: designs.id,
        designNumber: designs.number,
        title: designs.title,
        built: sql<number>`(select count(*)::int from ${buildUnits} u where u.order_id = ${buildOrders.id})`,
        passed: sql<number>`(select count(*)::int from ${buildUnits} u where u.order_id = ${buildOrders.id} and u.passed)`,
      })
      .from(buildOrders)
      .innerJoin(designRevisions, eq(designRevisions.id, buildOrders.revisionId))
      .innerJoin(designs, eq(designs.id, designRevisions.designId))
      .where(status ? eq(buildOrders.status, status) : undefined)
      .orderBy(desc(buildOrders.createdAt));
  }

  async order(id: number): Promise<StoredOrder | undefined> {
    const [row] = await this.db.select().from(buildOrders).where(eq(buildOrders.id, id));
    return row && storedOrder(row);
  }

  async units(orderId: number): Promise<StoredUnit[]> {
    const rows = await this.db.select().from(buildUnits).where(eq(buildUnits.orderId, orderId)).orderBy(asc(buildUnits.unitNumber));
    return rows.map(storedUnit);
  }

  /**
   * Adds a unit under a lock on the order, and completes the order when enough units passed; `onSaved` runs in the
   * same transaction (the audit entry), so a failure there undoes the unit too.
   */
  recordUnit(
    orderId: number,
    unit: Omit<typeof buildUnits.$inferInsert, 'orderId' | 'unitNumber'> & { findings: UnitFinding[] },
    onLocked: (order: OrderRow) => void,
    onSaved: (tx: Tx, order: OrderRow, unit: UnitRow) => Promise<void>,
  ) {
    return this.db.transaction(async (tx) => {
      const [order] = await tx.select().from(buildOrders).where(eq(buildOrders.id, orderId)).for('update');
      if (!order) return undefined;
      onLocked(order);
      const [{ n }] = await tx.select({ n: count() }).from(buildUnits).where(eq(buildUnits.orderId, orderId));
      const [row] = await tx
        .insert(buildUnits)
        .values({ ...unit, orderId, unitNumber: n + 1 })
        .returning();
      const [{ passed }] = await tx
        .select({ passed: count() })
        .from(buildUnits)
        .where(and(eq(buildUnits.orderId, orderId), eq(buildUnits.passed, true)));
      let status = order.status;
      if (passed >= order.quantity) {
        await tx.update(buildOrders).set({ status: 'complete', completedAt: new Date() }).where(eq(buildOrders.id, orderId));
        status = 'complete';
      }
      await onSaved(tx, order, row!);
      return { unit: { ...row!, findings: unit.findings }, orderStatus: status, passed };
    });
  }

  /** Every built unit with what was predicted for it (the order's sheet), for measured-versus-predicted summaries. */
  async measuredAgainstPredicted() {
    const rows = await this.db
      .select({
        orderId: buildOrders.id,
        orderNumber: buildOrders.number,
        designNumber: designs.number,
        revision: designRevisions.revision,
        sheet: buildOrders.sheet,
        result: designRevisions.result,
        inductance: buildUnits.inductance,
        resistanceAt20: buildUnits.resistanceAt20,
        passed: buildUnits.passed,
      })
      .from(buildUnits)
      .innerJoin(buildOrders, eq(buildOrders.id, buildUnits.orderId))
      .innerJoin(designRevisions, eq(designRevisions.id, buildOrders.revisionId))
      .innerJoin(designs, eq(designs.id, designRevisions.designId))
      .orderBy(asc(buildOrders.id), asc(buildUnits.unitNumber));
    // Each order's sheet is read once, however many units it has.
    const sheets = new Map<number, WindingSheet>();
    return rows.map((r) => {
      let sheet = sheets.get(r.orderId);
      if (!sheet) sheets.set(r.orderId, (sheet = storedSheet(r.sheet)));
      return { ...r, sheet };
    });
  }

  async setting<T>(key: string): Promise<T | undefined> {
    const [row] = await this.db.select().from(appSettings).where(eq(appSettings.key, key));
    return row?.value as T | undefined;
  }

  async putSetting(key: string, value: unknown, db: Tx | Db = this.db): Promise<void> {
    await db
      .insert(appSettings)
      .values({ key, value })
      .onConflictDoUpdate({ target: appSettings.key, set: { value, updatedAt: new Date() } });
  }
}
