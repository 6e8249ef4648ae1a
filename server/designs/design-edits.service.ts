import { may } from '@shared/api/permissions';
import type {
  CopyDesignRequest,
  CreateDesignRequest,
  DesignDetail,
  DesignFile,
  DesignSpec,
  NewRevisionRequest,
  RevisionDetail,
  UpdateRevisionRequest,
} from '@shared/schemas/designs';
import { readConstruction } from '@shared/schemas/designs';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import { conflict, forbidden, notFound } from '../http/errors.ts';
import type { ConstructionEvaluator, EvaluatedConstruction } from './construction-evaluator.ts';
import type { DesignWithOwner, DesignsRepository, NewRevisionRow } from './designs.repository.ts';
import type { DesignsService } from './designs.service.ts';
import { designDetail, revisionDetail } from './revision-views.ts';

/** Creating designs (new, copied, imported) and changing their drafts; every construction is evaluated before it is saved. */
export class DesignEditsService {
  constructor(
    private readonly repo: DesignsRepository,
    private readonly designs: DesignsService,
    private readonly evaluator: ConstructionEvaluator,
    private readonly audit: AuditService,
  ) {}

  async create(actor: Actor, request: CreateDesignRequest, action = 'design.created'): Promise<DesignDetail> {
    mustDesign(actor);
    const evaluated = request.construction ? await this.evaluator.evaluate(request.spec, request.construction) : undefined;
    const { design, revision } = await this.repo.db.transaction(async (tx) => {
      const design = await this.repo.insertDesign(tx, request.title, actor.id);
      const revision = await this.repo.insertRevision(tx, revisionValues(design.id, 1, actor.id, request.spec, evaluated, request.note));
      await this.audit.record({ actorId: actor.id, action, target: design.number, details: { title: design.title } }, tx);
      return { design, revision };
    });
    return designDetail(actor, { ...design, ownerName: actor.displayName }, [revision]);
  }

  async copy(actor: Actor, id: number, request: CopyDesignRequest): Promise<DesignDetail> {
    mustDesign(actor);
    const source = await this.designs.mustFind(id);
    const revisions = await this.repo.revisions(id);
    const from = request.revision ? revisions.find((r) => r.revision === request.revision) : revisions.at(-1);
    if (!from) throw notFound(`Design ${source.number} has no revision ${request.revision}.`);
    const construction = readConstruction(from.construction) ?? undefined;
    return this.create(
      actor,
      {
        title: request.title ?? `Copy of ${source.title}`.slice(0, 120),
        spec: from.spec as DesignSpec,
        construction,
        note: `Copied from ${source.number} revision ${from.revision}`,
      },
      'design.copied',
    );
  }

  importFile(actor: Actor, file: DesignFile): Promise<DesignDetail> {
    return this.create(
      actor,
      { title: file.title, spec: file.spec, construction: file.construction ?? undefined, note: 'Imported from a design file' },
      'design.imported',
    );
  }

  async update(actor: Actor, id: number, revision: number, request: UpdateRevisionRequest): Promise<RevisionDetail> {
    const design = await this.ownDesign(actor, id);
    const row = await this.repo.revision(id, revision);
    if (!row) throw notFound(`Design ${design.number} has no revision ${revision}.`);
    if (row.status !== 'draft')
      throw conflict(
        `Revision ${revision} of ${design.number} is ${row.status.replace('_', ' ')} and can no longer change; start a new revision.`,
      );
    const spec = request.spec ?? (row.spec as DesignSpec);
    const construction = request.construction === undefined ? readConstruction(row.construction) : request.construction;
    const evaluated = construction ? await this.evaluator.evaluate(spec, construction) : undefined;
    const values = revisionValues(id, revision, actor.id, spec, evaluated, request.note === undefined ? row.note : request.note);
    const updated = await this.repo.db.transaction(async (tx) => {
      const changed = await this.repo.updateRevision(tx, row.id, {
        spec: values.spec,
        construction: values.construction,
        result: values.result,
        engineVersion: values.engineVersion,
        materialId: values.materialId,
        note: values.note,
      });
      if (!changed) throw conflict(`Revision ${revision} of ${design.number} left the draft state while it was being saved.`);
      await this.repo.touchDesign(tx, id, request.title);
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'design.revision.updated',
          target: `${design.number} r${revision}`,
          details: { fields: Object.keys(request) },
        },
        tx,
      );
      return changed;
    });
    return revisionDetail(actor, design, updated);
  }

  async newRevision(actor: Actor, id: number, request: NewRevisionRequest): Promise<RevisionDetail> {
    const design = await this.ownDesign(actor, id);
    const created = await this.repo.db.transaction(async (tx) => {
      const revisions = await this.repo.revisions(id, tx);
      const latest = revisions.at(-1)!;
      const from = request.from ? revisions.find((r) => r.revision === request.from) : latest;
      if (!from) throw notFound(`Design ${design.number} has no revision ${request.from}.`);
      if (latest.status === 'draft') {
        throw conflict(`Revision ${latest.revision} of ${design.number} is still a draft; change it instead of starting another.`, {
          from: 'The latest revision is a draft',
        });
      }
      const revision = await this.repo.insertRevision(tx, {
        designId: id,
        revision: latest.revision + 1,
        status: 'draft',
        spec: from.spec,
        construction: from.construction,
        result: from.result,
        engineVersion: from.engineVersion,
        materialId: from.materialId,
        note: request.note ?? `Started from revision ${from.revision}`,
        createdBy: actor.id,
      });
      await this.repo.touchDesign(tx, id);
      await this.audit.record(
        { actorId: actor.id, action: 'design.revision.created', target: `${design.number} r${revision.revision}` },
        tx,
      );
      return revision;
    });
    return revisionDetail(actor, design, created);
  }

  /** The design, when the caller may design and owns it. */
  private async ownDesign(actor: Actor, id: number): Promise<DesignWithOwner> {
    mustDesign(actor);
    const design = await this.designs.mustFind(id);
    if (design.ownerId !== actor.id)
      throw forbidden(`Design ${design.number} belongs to ${design.ownerName}; copy it to make changes of your own.`);
    return design;
  }
}

function mustDesign(actor: Actor): void {
  if (!may(actor.role, 'design'))
    throw forbidden(`Only engineers and reviewers create and edit designs; you are signed in as ${actor.role}.`);
}

function revisionValues(
  designId: number,
  revision: number,
  actorId: number,
  spec: DesignSpec,
  evaluated: EvaluatedConstruction | undefined,
  note: string | null | undefined,
): NewRevisionRow {
  return {
    designId,
    revision,
    status: 'draft',
    spec,
    construction: evaluated?.construction ?? null,
    result: evaluated?.result ?? null,
    engineVersion: evaluated?.engineVersion ?? null,
    materialId: evaluated?.materialId ?? null,
    note: note ?? null,
    createdBy: actorId,
  };
}
