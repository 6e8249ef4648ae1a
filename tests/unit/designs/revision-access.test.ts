import { describe, expect, it } from 'vitest';
import { revisionAccess } from '../../../server/designs/revision-access.ts';

// The rules the review service enforces, stated per revision for the buttons (the same cases the
// revision-actions spec checked on the client before the server stated them).
const OWNER = 7;
const design = { ownerId: OWNER };
const allowed = (access: ReturnType<typeof revisionAccess>) =>
  Object.entries(access)
    .filter(([, may]) => may)
    .map(([flag]) => flag);

describe('revisionAccess', () => {
  it('lets the owner who designs edit and submit a draft, and nothing once it is in review', () => {
    expect(allowed(revisionAccess({ id: OWNER, role: 'engineer' }, design, { status: 'draft', createdBy: OWNER }))).toEqual([
      'canEdit',
      'canSubmit',
    ]);
    expect(allowed(revisionAccess({ id: OWNER, role: 'reviewer' }, design, { status: 'draft', createdBy: OWNER }))).toEqual([
      'canEdit',
      'canSubmit',
    ]);
    expect(allowed(revisionAccess({ id: OWNER, role: 'engineer' }, design, { status: 'in_review', createdBy: OWNER }))).toEqual([]);
  });

  it('gives another engineer nothing on a draft', () => {
    expect(allowed(revisionAccess({ id: 42, role: 'engineer' }, design, { status: 'draft', createdBy: OWNER }))).toEqual([]);
  });

  it('lets another reviewer approve or return a revision in review, and release or return an approved one', () => {
    const reviewer = { id: 42, role: 'reviewer' } as const;
    expect(allowed(revisionAccess(reviewer, design, { status: 'in_review', createdBy: OWNER }))).toEqual(['canApprove', 'canReturn']);
    expect(allowed(revisionAccess(reviewer, design, { status: 'approved', createdBy: OWNER }))).toEqual(['canReturn', 'canRelease']);
    expect(allowed(revisionAccess(reviewer, design, { status: 'released', createdBy: OWNER }))).toEqual([]);
  });

  it('never lets the owner or the revision’s author approve or release it, even as a reviewer', () => {
    expect(allowed(revisionAccess({ id: OWNER, role: 'reviewer' }, design, { status: 'in_review', createdBy: OWNER }))).toEqual([]);
    expect(allowed(revisionAccess({ id: 42, role: 'reviewer' }, design, { status: 'approved', createdBy: 42 }))).toEqual([]);
  });

  it('gives winders, admins and no caller nothing', () => {
    expect(allowed(revisionAccess({ id: 42, role: 'winder' }, design, { status: 'in_review', createdBy: OWNER }))).toEqual([]);
    expect(allowed(revisionAccess({ id: 42, role: 'admin' }, design, { status: 'approved', createdBy: OWNER }))).toEqual([]);
    expect(allowed(revisionAccess(null, design, { status: 'draft', createdBy: OWNER }))).toEqual([]);
  });
});
