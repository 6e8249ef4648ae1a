import { may } from '@shared/api/permissions';
import type { Role } from '@shared/schemas/auth';
import type { DesignStatus } from '@shared/schemas/designs';

/** What the caller may do with one revision, as the designs and review services decide it. */
export interface RevisionAccess {
  canEdit: boolean;
  canSubmit: boolean;
  canApprove: boolean;
  canReturn: boolean;
  canRelease: boolean;
}

export interface Caller {
  id: number;
  role: Role;
}

/** The owner may design and change their own designs. */
export const ownsAndDesigns = (caller: Caller | null, design: { ownerId: number }): boolean =>
  caller !== null && design.ownerId === caller.id && may(caller.role, 'design');

/**
 * The same rules the services enforce: the owner edits and submits a draft; another reviewer (never the
 * design's owner nor the revision's author) approves a revision in review, releases an approved one, and
 * returns either to draft.
 */
export function revisionAccess(
  caller: Caller | null,
  design: { ownerId: number },
  revision: { status: DesignStatus; createdBy: number | null },
): RevisionAccess {
  const owns = ownsAndDesigns(caller, design);
  const reviews = caller !== null && may(caller.role, 'review') && design.ownerId !== caller.id && revision.createdBy !== caller.id;
  const { status } = revision;
  return {
    canEdit: owns && status === 'draft',
    canSubmit: owns && status === 'draft',
    canApprove: reviews && status === 'in_review',
    canReturn: reviews && (status === 'in_review' || status === 'approved'),
    canRelease: reviews && status === 'approved',
  };
}
