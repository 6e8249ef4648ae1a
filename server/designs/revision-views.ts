import type { DesignDetail, DesignSpec, RevisionDetail, RevisionSummary } from '@shared/schemas/designs';
import { readConstruction, readStoredResult } from '@shared/schemas/designs';
import { formatQuantity } from '@shared/units/index';
import type { Actor } from '../http/access.ts';
import type { DesignWithOwner, RevisionRow } from './designs.repository.ts';
import { ownsAndDesigns, revisionAccess, type Caller } from './revision-access.ts';

// Stored rows → the answers of the designs API. A saved result that no longer reads (saved by an older
// version) is answered as none, with the reason beside it: the page then evaluates the construction afresh.

export function converterSummary(spec: DesignSpec | undefined): string {
  const c = spec?.converter;
  if (!c) return '';
  const vin =
    c.vinMin === c.vinMax
      ? formatQuantity(c.vinMin, 'voltage', 3)
      : `${formatQuantity(c.vinMin, 'voltage', 3).replace(/ .*$/, '')}–${formatQuantity(c.vinMax, 'voltage', 3)}`;
  return `${vin} → ${formatQuantity(c.vout, 'voltage', 3)}, ${formatQuantity(c.ioutMax, 'current', 3)}, ${formatQuantity(c.frequency, 'frequency', 3)}`;
}

export function designDetail(actor: Actor, design: DesignWithOwner, revisions: RevisionRow[]): DesignDetail {
  const latest = revisions.at(-1)!;
  return {
    id: design.id,
    number: design.number,
    title: design.title,
    owner: { id: design.ownerId, displayName: design.ownerName },
    createdAt: design.createdAt.toISOString(),
    updatedAt: design.updatedAt.toISOString(),
    canEdit: ownsAndDesigns(actor, design),
    canRevise: ownsAndDesigns(actor, design) && latest.status !== 'draft',
    revisions: revisions.map((row) => revisionSummary(actor, design, row)),
    latest: revisionDetail(actor, design, latest),
  };
}

export function revisionSummary(actor: Caller | null, design: { ownerId: number }, row: RevisionRow): RevisionSummary {
  return {
    id: row.id,
    revision: row.revision,
    status: row.status,
    engineVersion: row.engineVersion,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    totalLoss: readStoredResult(row.result).result?.evaluation.totalLoss ?? null,
    ...revisionAccess(actor, design, row),
  };
}

export function revisionDetail(actor: Caller | null, design: { ownerId: number }, row: RevisionRow): RevisionDetail {
  return {
    ...revisionSummary(actor, design, row),
    spec: row.spec as DesignSpec,
    construction: readConstruction(row.construction),
    ...readStoredResult(row.result),
    materialId: row.materialId,
  };
}
