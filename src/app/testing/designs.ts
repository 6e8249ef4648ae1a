import type { DesignDetail, RevisionDetail, RevisionSummary } from '@shared/schemas/designs';

/** A revision summary as the server sends it; nothing allowed unless the test says so. */
export function revisionSummary(overrides: Partial<RevisionSummary> = {}): RevisionSummary {
  return {
    id: 9,
    revision: 1,
    status: 'draft',
    engineVersion: null,
    note: null,
    createdAt: '2026-03-01T10:00:00.000Z',
    updatedAt: '2026-03-01T10:00:00.000Z',
    totalLoss: null,
    canEdit: false,
    canSubmit: false,
    canApprove: false,
    canReturn: false,
    canRelease: false,
    ...overrides,
  };
}

/** A design as `GET /api/designs/:id` answers it: the last of `revisions` is the latest, in full. */
export function designDetail(overrides: Partial<Omit<DesignDetail, 'latest'>> = {}): DesignDetail {
  const revisions = overrides.revisions ?? [revisionSummary()];
  const latest: RevisionDetail = {
    ...revisions[revisions.length - 1],
    spec: { converter: { vinMin: 24, vinMax: 48, vout: 12, ioutMax: 10, frequency: 250e3, rippleRatio: 0.4, rectifier: 'synchronous' } },
    construction: null,
    result: null,
    resultUnreadable: null,
    materialId: null,
  };
  return {
    id: 5,
    number: 'GW-0005',
    title: 'Sample rail',
    owner: { id: 7, displayName: 'Erin Example' },
    createdAt: '2026-03-01T10:00:00.000Z',
    updatedAt: '2026-03-01T10:00:00.000Z',
    canEdit: false,
    canRevise: false,
    ...overrides,
    revisions,
    latest,
  };
}
