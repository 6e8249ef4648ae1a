import { may } from '@shared/api/permissions';
import type { InboxItem } from '@shared/schemas/inbox';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import { AppError, badRequest, forbidden, notFound } from '../http/errors.ts';
import type { ShopService } from '../shop/shop.service.ts';
import type { DesignRow, ReviewRepository, RevisionRow, Tx } from './review.repository.ts';
import { storedEvaluation } from '@shared/schemas/designs';

type Status = RevisionRow['status'];

const stateConflict = (revision: RevisionRow, action: string, expected: Status[]) =>
  new AppError(
    409,
    'wrong_state',
    `Revision ${revision.revision} is ${revision.status.replace('_', ' ')}; it can be ${action} only when ${expected.join(' or ').replace('_', ' ')}.`,
  );

/**
 * The review and release flow: draft → in review → approved → released (→ superseded by a later
 * release); "return" sends a revision back to draft with comments. Every step is recorded on the
 * revision's timeline and in the audit log.
 */
export class ReviewService {
  constructor(
    private readonly repo: ReviewRepository,
    private readonly audit: AuditService,
    private readonly shop: ShopService,
  ) {}

  private async transition(
    actor: Actor,
    revisionId: number,
    action: string,
    guard: (revision: RevisionRow, design: DesignRow) => void,
    apply: (tx: Tx, revision: RevisionRow, design: DesignRow) => Promise<{ to: Status; details?: Record<string, unknown> }>,
    comment?: string,
  ) {
    const outcome = await this.repo.transaction(async (tx) => {
      const row = await this.repo.lockRevision(tx, revisionId);
      if (!row) throw notFound('No such revision.');
      const { revision, design } = row;
      guard(revision, design);
      const { to, details } = await apply(tx, revision, design);
      await this.repo.addTransition(tx, {
        revisionId,
        fromStatus: revision.status,
        toStatus: to,
        actorId: actor.id,
        comment: comment ?? null,
      });
      await this.audit.record(
        {
          actorId: actor.id,
          action: `revision.${action}`,
          target: `${design.number} rev ${revision.revision}`,
          details: { from: revision.status, to, ...(comment ? { comment } : {}), ...details },
        },
        tx,
      );
      return { revision, design, to, details };
    });
    return { revisionId, status: outcome.to, ...outcome.details };
  }

  submit(actor: Actor, revisionId: number, comment?: string) {
    return this.transition(
      actor,
      revisionId,
      'submitted',
      (revision, design) => {
        if (design.ownerId !== actor.id) throw forbidden('Only the design owner can submit it for review.');
        if (revision.status !== 'draft') throw stateConflict(revision, 'submitted', ['draft']);
        const result = storedEvaluation(revision.result);
        if (!result || !revision.construction) {
          throw badRequest('Choose and save a construction (core, material, turns, gap, wire) before submitting.', {
            construction: 'No saved construction',
          });
        }
        if (!result.feasible) {
          const reasons = result.issues.filter((i) => i.severity === 'error').map((i) => i.message);
          throw badRequest(`The saved design is not feasible: ${reasons.join('; ')}`, { construction: 'Not feasible' });
        }
      },
      async (tx, revision) => {
        await this.repo.setStatus(tx, revision.id, 'in_review');
        return { to: 'in_review' };
      },
      comment,
    );
  }

  approve(actor: Actor, revisionId: number, comment?: string) {
    return this.transition(
      actor,
      revisionId,
      'approved',
      (revision, design) => {
        if (!may(actor.role, 'review')) throw forbidden('Only a reviewer can approve a design.');
        if (design.ownerId === actor.id || revision.createdBy === actor.id)
          throw forbidden('The author of a design cannot approve it; ask another reviewer.');
        if (revision.status !== 'in_review') throw stateConflict(revision, 'approved', ['in_review']);
      },
      async (tx, revision) => {
        await this.repo.setStatus(tx, revision.id, 'approved', { approvedBy: actor.id });
        return { to: 'approved' };
      },
      comment,
    );
  }

  returnToDraft(actor: Actor, revisionId: number, comment: string) {
    return this.transition(
      actor,
      revisionId,
      'returned',
      (revision) => {
        if (!may(actor.role, 'review')) throw forbidden('Only a reviewer can return a design.');
        if (revision.status !== 'in_review' && revision.status !== 'approved')
          throw stateConflict(revision, 'returned', ['in_review', 'approved']);
      },
      async (tx, revision) => {
        await this.repo.setStatus(tx, revision.id, 'draft', { approvedBy: null });
        return { to: 'draft' };
      },
      comment,
    );
  }

  release(actor: Actor, revisionId: number, quantity: number, comment?: string) {
    return this.transition(
      actor,
      revisionId,
      'released',
      (revision, design) => {
        if (!may(actor.role, 'review')) throw forbidden('Only a reviewer can release a design.');
        if (design.ownerId === actor.id || revision.createdBy === actor.id)
          throw forbidden('The author of a design cannot release it; ask another reviewer.');
        if (revision.status !== 'approved') throw stateConflict(revision, 'released', ['approved']);
      },
      async (tx, revision, design) => {
        const releasedAt = new Date();
        await this.repo.setStatus(tx, revision.id, 'released', { releasedAt });
        const superseded = await this.repo.supersedeReleased(tx, design.id, revision.id);
        for (const id of superseded) {
          await this.repo.addTransition(tx, {
            revisionId: id,
            fromStatus: 'released',
            toStatus: 'superseded',
            actorId: actor.id,
            comment: `Superseded by revision ${revision.revision}`,
          });
        }
        const order = await this.shop.createOrder(tx, { revision, design, quantity, releasedAt, releasedBy: actor.id });
        await this.shop.queueReleaseMail(tx, order);
        return { to: 'released', details: { orderId: order.id, orderNumber: order.number, superseded } };
      },
      comment,
    );
  }

  async timeline(revisionId: number) {
    const row = await this.repo.revision(revisionId);
    if (!row) throw notFound('No such revision.');
    const ids = await this.repo.revisionIdsOfDesign(row.design.id);
    const entries = await this.repo.timeline(ids);
    return { designId: row.design.id, entries: entries.map((e) => ({ ...e, at: e.at.toISOString() })) };
  }

  /** What is waiting for this person. */
  async inbox(actor: Actor): Promise<{ items: InboxItem[] }> {
    const items: InboxItem[] = [];
    if (may(actor.role, 'review')) {
      for (const r of await this.repo.revisionsInStatus(['in_review', 'approved'])) {
        if (r.ownerId === actor.id || r.createdBy === actor.id) continue;
        items.push({
          kind: r.status === 'in_review' ? 'review' : 'release',
          label: `${r.status === 'in_review' ? 'Review' : 'Release'} ${r.designNumber} rev ${r.revision} — ${r.title}`,
          designId: r.designId,
          revisionId: r.revisionId,
          since: r.updatedAt.toISOString(),
        });
      }
    }
    if (may(actor.role, 'design')) {
      for (const r of await this.repo.returnedDraftsOf(actor.id)) {
        items.push({
          kind: 'returned',
          label: `Returned: ${r.design_number} rev ${r.revision} — ${r.comment ?? ''}`.trim(),
          designId: r.design_id,
          revisionId: r.revision_id,
          since: new Date(r.at).toISOString(),
        });
      }
    }
    if (may(actor.role, 'build')) {
      for (const o of await this.shop.openOrders()) {
        items.push({
          kind: 'build',
          label: `Build ${o.number}: ${o.designNumber} rev ${o.revision}, ${o.built}/${o.quantity} passed`,
          designId: o.designId,
          orderId: o.id,
          since: o.createdAt,
        });
      }
    }
    return { items };
  }
}
