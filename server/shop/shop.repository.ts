import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
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
/** An order's next unit number and the voided numbers that may be recorded again. */
export interface UnitNumbers {
  next: number;
  reusable: number[];
}

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

  orders(status?: 'open' | 'complete', designId?: number) {
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
        built: sql<number>`(select count(*)::int from ${buildUnits} u where u.order_id = ${buildOrders.id} and u.voided_at is null)`,
        passed: sql<number>`(select count(*)::int from ${buildUnits} u where u.order_id = ${buildOrders.id} and u.passed and u.voided_at is null)`,
      })
      .from(buildOrders)
      .innerJoin(designRevisions, eq(designRevisions.id, buildOrders.revisionId))
      .innerJoin(designs, eq(designs.id, designRevisions.designId))
      .where(and(status ? eq(buildOrders.status, status) : undefined, designId !== undefined ? eq(designs.id, designId) : undefined))
      .orderBy(desc(buildOrders.createdAt));
  }

  async order(id: number): Promise<StoredOrder | undefined> {
    const [row] = await this.db.select().from(buildOrders).where(eq(buildOrders.id, id));
    return row && storedOrder(row);
  }

  async units(orderId: number): Promise<StoredUnit[]> {
    const rows = await this.db
      .select()
      .from(buildUnits)
      .where(eq(buildUnits.orderId, orderId))
      .orderBy(asc(buildUnits.unitNumber), asc(buildUnits.id));
    return rows.map(storedUnit);
  }

  async unit(id: number): Promise<StoredUnit | undefined> {
    const [row] = await this.db.select().from(buildUnits).where(eq(buildUnits.id, id));
    return row && storedUnit(row);
  }

  /** Passing units of an order that stand (voided records left out). */
  private async passedUnits(tx: Tx, orderId: number): Promise<number> {
    const [{ n }] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(buildUnits)
      .where(and(eq(buildUnits.orderId, orderId), eq(buildUnits.passed, true), isNull(buildUnits.voidedAt)));
    return n;
  }

  /**
   * Adds a unit under a lock on the order, and completes the order when enough units passed; `onSaved` runs in the
   * same transaction (the audit entry), so a failure there undoes the unit too.
   */
  recordUnit(
    orderId: number,
    unit: Omit<typeof buildUnits.$inferInsert, 'orderId' | 'unitNumber'> & { findings: UnitFinding[] },
    unitNumber: number | undefined,
    onLocked: (order: OrderRow, numbers: UnitNumbers) => void,
    onSaved: (tx: Tx, order: OrderRow, unit: UnitRow) => Promise<void>,
  ) {
    return this.db.transaction(async (tx) => {
      const [order] = await tx.select().from(buildOrders).where(eq(buildOrders.id, orderId)).for('update');
      if (!order) return undefined;
      const numbers = await this.unitNumbers(tx, orderId);
      onLocked(order, numbers);
      const [row] = await tx
        .insert(buildUnits)
        .values({ ...unit, orderId, unitNumber: unitNumber ?? numbers.next })
        .returning();
      const passed = await this.passedUnits(tx, orderId);
      let status = order.status;
      if (passed >= order.quantity) {
        await tx.update(buildOrders).set({ status: 'complete', completedAt: new Date() }).where(eq(buildOrders.id, orderId));
        status = 'complete';
      }
      await onSaved(tx, order, row!);
      return { unit: { ...row!, findings: unit.findings }, orderStatus: status, passed };
    });
  }

  /** The next unit number of an order, and the voided numbers not yet recorded again (under the order's lock). */
  private async unitNumbers(tx: Tx, orderId: number): Promise<UnitNumbers> {
    const rows = await tx
      .select({ unitNumber: buildUnits.unitNumber, voided: sql<boolean>`${buildUnits.voidedAt} is not null` })
      .from(buildUnits)
      .where(eq(buildUnits.orderId, orderId));
    const standing = new Set(rows.filter((r) => !r.voided).map((r) => r.unitNumber));
    const reusable = [...new Set(rows.filter((r) => r.voided && !standing.has(r.unitNumber)).map((r) => r.unitNumber))].sort(
      (a, b) => a - b,
    );
    return { next: rows.reduce((max, r) => Math.max(max, r.unitNumber), 0) + 1, reusable };
  }

  /**
   * Voids one unit record under a lock on its order, and opens a complete order again when its standing passed units
   * fall below the quantity; `check` runs on the locked rows (who may, already voided) and `onVoided` in the same
   * transaction (the audit entry).
   */
  voidUnit(
    unitId: number,
    by: number,
    reason: string,
    check: (order: OrderRow, unit: UnitRow) => void,
    onVoided: (tx: Tx, order: OrderRow, unit: UnitRow) => Promise<void>,
  ) {
    return this.db.transaction(async (tx) => {
      const [found] = await tx.select({ orderId: buildUnits.orderId }).from(buildUnits).where(eq(buildUnits.id, unitId));
      if (!found) return undefined;
      const [order] = await tx.select().from(buildOrders).where(eq(buildOrders.id, found.orderId)).for('update');
      const [unit] = await tx.select().from(buildUnits).where(eq(buildUnits.id, unitId)).for('update');
      check(order!, unit!);
      const [row] = await tx
        .update(buildUnits)
        .set({ voidedAt: new Date(), voidedBy: by, voidReason: reason })
        .where(eq(buildUnits.id, unitId))
        .returning();
      const passed = await this.passedUnits(tx, order!.id);
      let status = order!.status;
      if (status === 'complete' && passed < order!.quantity) {
        await tx.update(buildOrders).set({ status: 'open', completedAt: null }).where(eq(buildOrders.id, order!.id));
        status = 'open';
      }
      await onVoided(tx, order!, row!);
      return { unit: storedUnit(row!), orderStatus: status, passed };
    });
  }

  /** Every standing built unit (voided records left out) with what was predicted for it (the order's sheet), for measured-versus-predicted summaries. */
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
      .where(isNull(buildUnits.voidedAt))
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
