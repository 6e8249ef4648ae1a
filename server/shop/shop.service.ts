import { may } from '@shared/api/permissions';
import { storedEvaluation, storedWire } from '@shared/schemas/designs';
import type {
  BuildOrder,
  BuiltUnit,
  OrderSummary,
  PredictionReport,
  RecordedUnit,
  UnitMeasurementRequest,
  VoidUnitRequest,
} from '@shared/schemas/shop';
import { judgeUnit } from '@shared/shop/measurement';
import type { WindingSheet } from '@shared/shop/sheet';
import { predictedAtPins } from '@shared/shop/test-limits';
import type { AuditService } from '../audit/audit.service.ts';
import type { CatalogueService } from '../catalogue/catalogue.service.ts';
import type { Actor } from '../http/access.ts';
import { AppError, conflict, forbidden, notFound } from '../http/errors.ts';
import type { MailDeliveryService, OutgoingMail } from '../mail/mail-delivery.service.ts';
import type { Tx } from '../db/client.ts';
import { summariseRatios } from './prediction-error.ts';
import { renderSheetPdf } from './sheet-pdf.ts';
import type { ShopRepository, StoredUnit } from './shop.repository.ts';
import { buildWindingSheet } from './winding-sheet.ts';

export const SHOP_EMAIL_KEY = 'shop_email';
const RELEASE_MAIL = 'release';
export const DEFAULT_SHOP_EMAIL = 'shop@harrow-lane.example';

interface StoredSpec {
  limits?: { inductanceTolerance?: number };
  inductanceTolerance?: number;
  insulationRequired?: boolean;
  hipotInstruction?: string;
}

/**
 * What a release hands the shop: the revision with its frozen result and its design. The review feature passes
 * its rows; the shop names only the columns it reads, so it depends on no other feature's row types.
 */
export interface ReleasedRevision {
  revision: {
    id: number;
    revision: number;
    spec: unknown;
    result: unknown;
    engineVersion: string | null;
    createdBy: number | null;
    approvedBy: number | null;
  };
  design: { number: string; title: string; ownerId: number };
  quantity: number;
  releasedAt: Date;
  releasedBy: number;
}

/** May this user void this record now: its recorder (who may record units) or a reviewer or admin, if it stands. */
const mayVoid = (actor: Actor, u: StoredUnit) =>
  u.voidedAt === null && (may(actor.role, 'voidAnyUnit') || (may(actor.role, 'voidUnit') && u.recordedBy === actor.id));

const unitAnswer = (actor: Actor, u: StoredUnit): BuiltUnit => ({
  ...u,
  recordedAt: u.recordedAt.toISOString(),
  voidedAt: u.voidedAt?.toISOString() ?? null,
  canVoid: mayVoid(actor, u),
});

/** The winding shop: build orders with their frozen sheets, the hand-off mail, and built units. */
export class ShopService {
  constructor(
    private readonly repo: ShopRepository,
    private readonly catalogue: CatalogueService,
    private readonly mail: MailDeliveryService,
    private readonly audit: AuditService,
  ) {
    mail.defineKind(RELEASE_MAIL, (orderId) => this.releaseMail(orderId));
  }

  /** Called inside the release transaction: the sheet is built now and never recomputed. */
  async createOrder(tx: Tx, input: ReleasedRevision) {
    const { revision, design } = input;
    const result = storedEvaluation(revision.result);
    const wire = storedWire(revision.result);
    if (!result || !wire) throw new AppError(409, 'no_result', 'The revision has no saved engine result to build a winding sheet from.');
    const spec = (revision.spec ?? {}) as StoredSpec;
    const number = await this.repo.nextOrderNumber(tx);
    const core = this.catalogue.cores().find((c) => c.id === result.core.id);
    const sheet = buildWindingSheet({
      design: { number: design.number, title: design.title },
      revision: {
        revision: revision.revision,
        engineVersion: revision.engineVersion ?? 'unknown',
        inductanceTolerance: spec.limits?.inductanceTolerance ?? spec.inductanceTolerance ?? 0.1,
      },
      order: { number, quantity: input.quantity, releasedAt: input.releasedAt },
      author: await this.repo.userName(tx, revision.createdBy ?? design.ownerId),
      approver: await this.repo.userName(tx, revision.approvedBy),
      result,
      core,
      wire,
      insulation: { required: spec.insulationRequired === true, hipotInstruction: spec.hipotInstruction },
    });
    return this.repo.insertOrder(tx, { number, revisionId: revision.id, quantity: input.quantity, sheet, createdBy: input.releasedBy });
  }

  async shopEmail(): Promise<string> {
    return (await this.repo.setting<string>(SHOP_EMAIL_KEY)) ?? DEFAULT_SHOP_EMAIL;
  }

  async setShopEmail(actor: Actor, email: string): Promise<void> {
    await this.repo.db.transaction(async (tx) => {
      await this.repo.putSetting(SHOP_EMAIL_KEY, email, tx);
      await this.audit.record({ actorId: actor.id, action: 'settings.shop_email', details: { email } }, tx);
    });
  }

  /** Inside the release transaction: the hand-off mail is queued with the order, so neither exists alone. */
  async queueReleaseMail(tx: Tx, order: { id: number; number: string; sheet: WindingSheet }): Promise<number> {
    const subject = releaseSubject(order.number, order.sheet);
    return this.mail.queue(tx, RELEASE_MAIL, { orderId: order.id, ref: order.id, to: await this.shopEmail(), subject });
  }

  async releaseMail(orderId: number): Promise<OutgoingMail> {
    const order = await this.repo.order(orderId);
    if (!order) throw new Error(`build order ${orderId} vanished`);
    const { sheet } = order;
    const text = [
      `${sheet.header.designNumber} rev ${sheet.header.revision} — ${sheet.header.title} has been released to the winding shop.`,
      `Build order ${order.number}, quantity ${order.quantity}. Approved by ${sheet.header.approver}.`,
      '',
      `${sheet.winding.turns} turns of ${sheet.parts.wire.description} on ${sheet.parts.coreSet}, ${sheet.parts.coreMaterial}.`,
      `Gap: ${sheet.parts.gap.note}`,
      '',
      'The winding sheet with the test limits is attached (PDF) and shown in Gapwright under Winding shop.',
      '',
      sheet.caution,
    ].join('\n');
    return {
      to: await this.shopEmail(),
      subject: releaseSubject(order.number, sheet),
      text,
      attachments: [{ filename: sheetFileName(sheet), content: await renderSheetPdf(sheet), contentType: 'application/pdf' }],
    };
  }

  async listOrders(status?: 'open' | 'complete', designId?: number): Promise<{ orders: OrderSummary[] }> {
    const orders = (await this.repo.orders(status, designId)).map((o) => ({
      ...o,
      createdAt: o.createdAt.toISOString(),
      completedAt: o.completedAt?.toISOString() ?? null,
    }));
    return { orders };
  }

  async openOrders(): Promise<OrderSummary[]> {
    return (await this.listOrders('open')).orders;
  }

  /** The order as this user sees it: `canRecord` says whether they may record a unit on it now. */
  async order(actor: Actor, id: number): Promise<BuildOrder> {
    const order = await this.repo.order(id);
    if (!order) throw notFound('No such build order.');
    const units = await this.repo.units(id);
    return {
      ...order,
      createdAt: order.createdAt.toISOString(),
      completedAt: order.completedAt?.toISOString() ?? null,
      units: units.map((u) => unitAnswer(actor, u)),
      canRecord: may(actor.role, 'build') && order.status === 'open',
    };
  }

  async sheetPdf(id: number): Promise<{ fileName: string; pdf: Buffer }> {
    const order = await this.repo.order(id);
    if (!order) throw notFound('No such build order.');
    return { fileName: sheetFileName(order.sheet), pdf: await renderSheetPdf(order.sheet) };
  }

  async recordUnit(actor: Actor, orderId: number, m: UnitMeasurementRequest): Promise<RecordedUnit> {
    const order = await this.repo.order(orderId);
    if (!order) throw notFound('No such build order.');
    const judged = judgeUnit(order.sheet.tests, m);
    const saved = await this.repo.recordUnit(
      orderId,
      {
        inductance: m.inductance,
        testFrequency: m.testFrequency,
        resistance: m.resistance,
        resistanceTemperature: m.resistanceTemperature,
        resistanceAt20: judged.resistanceAt20,
        biasCurrent: m.biasCurrent ?? null,
        biasInductance: m.biasInductance ?? null,
        hipot: m.hipot,
        passed: judged.passed,
        findings: judged.findings,
        notes: m.notes ?? null,
        recordedBy: actor.id,
      },
      m.unitNumber,
      (locked, numbers) => {
        if (locked.status === 'complete')
          throw new AppError(409, 'order_complete', `Build order ${locked.number} is complete; no more units can be recorded.`);
        if (m.unitNumber !== undefined && m.unitNumber !== numbers.next && !numbers.reusable.includes(m.unitNumber)) {
          const again = numbers.reusable.length ? `; voided numbers to record again: ${numbers.reusable.join(', ')}` : '';
          throw conflict(`Unit ${m.unitNumber} has a record that stands; void it first. The next unit is ${numbers.next}${again}.`, {
            unitNumber: `unitNumber must be ${numbers.next} or a voided unit number`,
          });
        }
      },
      (tx, locked, unit) =>
        this.audit.record(
          {
            actorId: actor.id,
            action: 'shop.unit_recorded',
            target: `${locked.number} unit ${unit.unitNumber}`,
            details: { passed: judged.passed, ...(m.unitNumber !== undefined ? { recordedAgain: true } : {}) },
          },
          tx,
        ),
    );
    if (!saved) throw notFound('No such build order.');
    return {
      unit: unitAnswer(actor, saved.unit),
      orderStatus: saved.orderStatus,
      passedUnits: saved.passed,
    };
  }

  /** Voids a wrong record with a reason: kept, audited, left out of counts and reports; its number can be recorded again. */
  async voidUnit(actor: Actor, unitId: number, { reason }: VoidUnitRequest): Promise<RecordedUnit> {
    const saved = await this.repo.voidUnit(
      unitId,
      actor.id,
      reason,
      (order, row) => {
        const unit = { ...row, findings: [] };
        if (row.voidedAt !== null)
          throw new AppError(409, 'already_voided', `Unit ${row.unitNumber} of ${order.number} is already voided.`);
        if (!mayVoid(actor, unit))
          throw forbidden(`Only the unit's recorder, a reviewer or an admin may void unit ${row.unitNumber} of ${order.number}.`);
      },
      (tx, order, row) =>
        this.audit.record(
          {
            actorId: actor.id,
            action: 'shop.unit_voided',
            target: `${order.number} unit ${row.unitNumber}`,
            details: { unitId: row.id, reason, passed: row.passed },
          },
          tx,
        ),
    );
    if (!saved) throw notFound('No such unit.');
    return { unit: unitAnswer(actor, saved.unit), orderStatus: saved.orderStatus, passedUnits: saved.passed };
  }

  /** Measured against predicted for every build, and the prediction error by material and by core. */
  async predictionReport(): Promise<PredictionReport> {
    const rows = await this.repo.measuredAgainstPredicted();
    const samples = rows.map(({ sheet, ...r }) => {
      const result = storedEvaluation(r.result);
      // A unit is measured at its pins: against the winding, its leads and joints where the sheet gives them (sheets
      // released before the lead resistance was stated predict the winding alone).
      const predictedResistance20 = sheet.tests.resistance ? predictedAtPins(sheet.tests.resistance) : sheet.predicted.resistance20;
      return {
        orderNumber: r.orderNumber,
        designNumber: r.designNumber,
        revision: r.revision,
        material: sheet.parts.coreMaterial,
        core: result?.core.id ?? 'unknown',
        predictedInductance: sheet.predicted.inductanceNominal,
        measuredInductance: r.inductance,
        predictedResistance20,
        measuredResistance20: r.resistanceAt20,
        passed: r.passed,
        inductanceRatio: r.inductance / sheet.predicted.inductanceNominal,
        resistanceRatio: r.resistanceAt20 / predictedResistance20,
      };
    });
    return {
      units: samples,
      byMaterial: summariseRatios(samples.map((s) => ({ ...s, key: s.material }))),
      byCore: summariseRatios(samples.map((s) => ({ ...s, key: s.core }))),
    };
  }
}

function releaseSubject(orderNumber: string, sheet: WindingSheet): string {
  return `Build order ${orderNumber}: ${sheet.header.designNumber} rev ${sheet.header.revision}, quantity ${sheet.header.quantity}`;
}

export function sheetFileName(sheet: WindingSheet): string {
  return `${sheet.header.designNumber}-rev${sheet.header.revision}-${sheet.header.orderNumber}-winding-sheet.pdf`.replace(
    /[^A-Za-z0-9._-]/g,
    '_',
  );
}
