import type { EvaluationResult } from '@shared/engine/index';
import { may } from '@shared/api/permissions';
import type {
  Construction,
  CopyDesignRequest,
  CreateDesignRequest,
  DesignDetail,
  DesignFile,
  DesignListQuery,
  DesignListResponse,
  DesignSpec,
  NewRevisionRequest,
  RevisionDetail,
  RevisionDiff,
  RevisionSummary,
  StoredResult,
  UpdateRevisionRequest,
} from '@shared/schemas/designs';
import { storedEvaluation } from '@shared/schemas/designs';
import { distinct, isStoredIdText } from '@shared/schemas/ids';
import { formatQuantity } from '@shared/units/index';
import type { AuditService } from '../audit/audit.service.ts';
import type { CalcService } from '../calc/calc.service.ts';
import type { Actor } from '../http/access.ts';
import { conflict, forbidden, notFound } from '../http/errors.ts';
import { GenerationMemo } from '../http/generation-cache.ts';
import type { MaterialsRepository } from '../materials/materials.repository.ts';
import { diffObjects } from './flatten.ts';
import { ownsAndDesigns, revisionAccess, type Caller } from './revision-access.ts';
import type { DesignWithOwner, DesignsRepository, NewRevisionRow, RevisionRow } from './designs.repository.ts';

export interface EvaluatedConstruction {
  construction: Construction;
  result: StoredResult;
  engineVersion: string;
  materialId: number;
}

export function converterSummary(spec: DesignSpec | undefined): string {
  const c = spec?.converter;
  if (!c) return '';
  const vin =
    c.vinMin === c.vinMax
      ? formatQuantity(c.vinMin, 'voltage', 3)
      : `${formatQuantity(c.vinMin, 'voltage', 3).replace(/ .*$/, '')}–${formatQuantity(c.vinMax, 'voltage', 3)}`;
  return `${vin} → ${formatQuantity(c.vout, 'voltage', 3)}, ${formatQuantity(c.ioutMax, 'current', 3)}, ${formatQuantity(c.frequency, 'frequency', 3)}`;
}

export class DesignsService {
  constructor(
    private readonly repo: DesignsRepository,
    private readonly calc: CalcService,
    private readonly materials: MaterialsRepository,
    private readonly audit: AuditService,
  ) {}

  private readonly listed = new GenerationMemo<DesignListResponse>();

  /**
   * A page of the list. With `generation` (the designs' change counter read with the request's session) a page
   * already built under the same counter is given again: the list is read on most visits and changes rarely.
   */
  list(actor: Actor, query: DesignListQuery, generation?: string): Promise<DesignListResponse> {
    // Only "mine" depends on who asks; every signed-in user sees the same "all" pages.
    const key = JSON.stringify([
      query.scope === 'mine' ? actor.id : 0,
      query.scope,
      query.q,
      query.status,
      query.sort,
      query.dir,
      query.page,
      query.pageSize,
    ]);
    return this.listed.get(key, generation, () => this.buildList(actor, query));
  }

  private async buildList(actor: Actor, query: DesignListQuery): Promise<DesignListResponse> {
    const { rows, total } = await this.repo.list(query, actor.id);
    return {
      total,
      page: query.page,
      pageSize: query.pageSize,
      items: rows.map((r) => ({
        id: r.id,
        number: r.number,
        title: r.title,
        owner: { id: r.ownerId, displayName: r.ownerName },
        status: r.status,
        revision: r.revision,
        summary: converterSummary(r.spec as DesignSpec),
        updatedAt: r.updatedAt.toISOString(),
      })),
    };
  }

  async get(actor: Actor, id: number): Promise<DesignDetail> {
    const design = await this.mustFind(id);
    const revisions = await this.repo.revisions(id);
    return this.detail(actor, design, revisions);
  }

  /** One revision; what the caller may do with it is stated when a caller is given. */
  async revision(
    id: number,
    revision: number,
    actor: Caller | null = null,
  ): Promise<RevisionDetail & { design: { id: number; number: string; title: string } }> {
    const design = await this.mustFind(id);
    const row = await this.repo.revision(id, revision);
    if (!row) throw notFound(`Design ${design.number} has no revision ${revision}.`);
    return { ...revisionDetail(actor, design, row), design: { id: design.id, number: design.number, title: design.title } };
  }

  async create(actor: Actor, request: CreateDesignRequest, action = 'design.created'): Promise<DesignDetail> {
    this.mustDesign(actor);
    const evaluated = request.construction ? await this.evaluate(request.spec, request.construction) : undefined;
    const { design, revision } = await this.repo.db.transaction(async (tx) => {
      const design = await this.repo.insertDesign(tx, request.title, actor.id);
      const revision = await this.repo.insertRevision(tx, revisionValues(design.id, 1, actor.id, request.spec, evaluated, request.note));
      await this.audit.record({ actorId: actor.id, action, target: design.number, details: { title: design.title } }, tx);
      return { design, revision };
    });
    return this.detail(actor, { ...design, ownerName: actor.displayName }, [revision]);
  }

  async copy(actor: Actor, id: number, request: CopyDesignRequest): Promise<DesignDetail> {
    this.mustDesign(actor);
    const source = await this.mustFind(id);
    const revisions = await this.repo.revisions(id);
    const from = request.revision ? revisions.find((r) => r.revision === request.revision) : revisions.at(-1);
    if (!from) throw notFound(`Design ${source.number} has no revision ${request.revision}.`);
    const construction = (from.construction as Construction | null) ?? undefined;
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
    this.mustDesign(actor);
    const design = await this.mustFind(id);
    this.mustOwn(actor, design);
    const row = await this.repo.revision(id, revision);
    if (!row) throw notFound(`Design ${design.number} has no revision ${revision}.`);
    if (row.status !== 'draft')
      throw conflict(
        `Revision ${revision} of ${design.number} is ${row.status.replace('_', ' ')} and can no longer change; start a new revision.`,
      );
    const spec = request.spec ?? (row.spec as DesignSpec);
    const construction = request.construction === undefined ? (row.construction as Construction | null) : request.construction;
    const evaluated = construction ? await this.evaluate(spec, construction) : undefined;
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
    this.mustDesign(actor);
    const design = await this.mustFind(id);
    this.mustOwn(actor, design);
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

  async diff(id: number, from: number, to: number): Promise<RevisionDiff> {
    const design = await this.mustFind(id);
    const [a, b] = await Promise.all([this.repo.revision(id, from), this.repo.revision(id, to)]);
    if (!a) throw notFound(`Design ${design.number} has no revision ${from}.`);
    if (!b) throw notFound(`Design ${design.number} has no revision ${to}.`);
    return {
      from,
      to,
      spec: diffObjects(a.spec, b.spec),
      construction: diffObjects(a.construction, b.construction),
      result: diffObjects(storedEvaluation(a.result) ?? undefined, storedEvaluation(b.result) ?? undefined).filter(
        (d) => !d.path.startsWith('issues'),
      ),
    };
  }

  /** Runs the engine on a construction; turns and gap are stored as the engine resolved them. */
  async evaluate(spec: DesignSpec, construction: Construction): Promise<EvaluatedConstruction> {
    const evaluated = await this.calc.evaluate(
      {
        spec: spec.converter,
        limits: spec.limits,
        coreId: construction.coreId,
        materialId: construction.materialId,
        turns: construction.turns,
        gap: construction.gap,
        wire: construction.wire,
      },
      {},
    );
    const evaluation = evaluated.result as EvaluationResult;
    return {
      construction: {
        ...construction,
        turns: evaluation.turns,
        gap: evaluation.gap.total,
      },
      result: { wire: evaluated.wire, evaluation },
      engineVersion: evaluated.engineVersion,
      materialId: Number(construction.materialId),
    };
  }

  async materialNames(): Promise<Map<string, string>> {
    const rows = await this.materials.listCurrent(true);
    return new Map(rows.map((r) => [String(r.id), r.name]));
  }

  /**
   * The stored materials a saved spec searches: its own list, else every current material. Ids in the list
   * that are not stored ids (a spec saved before ids were range-checked may hold "99999999999") or name no
   * stored material are left out, so such a design still exports its candidates.
   */
  async searchMaterialIds(spec: DesignSpec): Promise<string[]> {
    if (!spec.materialIds?.length) return (await this.materials.listCurrent()).map((r) => String(r.id));
    const wanted = distinct(spec.materialIds.filter(isStoredIdText).map(Number));
    const stored = new Set((await this.materials.findByIds(wanted)).map((r) => r.id));
    return wanted.filter((id) => stored.has(id)).map(String);
  }

  async mustFind(id: number): Promise<DesignWithOwner> {
    const design = await this.repo.findDesign(id);
    if (!design) throw notFound(`No design with id ${id}.`);
    return design;
  }

  private mustDesign(actor: Actor): void {
    if (!may(actor.role, 'design'))
      throw forbidden(`Only engineers and reviewers create and edit designs; you are signed in as ${actor.role}.`);
  }

  private mustOwn(actor: Actor, design: DesignWithOwner): void {
    if (design.ownerId !== actor.id)
      throw forbidden(`Design ${design.number} belongs to ${design.ownerName}; copy it to make changes of your own.`);
  }

  private detail(actor: Actor, design: DesignWithOwner, revisions: RevisionRow[]): DesignDetail {
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

function revisionSummary(actor: Caller | null, design: { ownerId: number }, row: RevisionRow): RevisionSummary {
  const evaluation = storedEvaluation(row.result);
  return {
    id: row.id,
    revision: row.revision,
    status: row.status,
    engineVersion: row.engineVersion,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    totalLoss: evaluation?.totalLoss ?? null,
    ...revisionAccess(actor, design, row),
  };
}

export function revisionDetail(actor: Caller | null, design: { ownerId: number }, row: RevisionRow): RevisionDetail {
  return {
    ...revisionSummary(actor, design, row),
    spec: row.spec as DesignSpec,
    construction: (row.construction as Construction | null) ?? null,
    result: (row.result as StoredResult | null) ?? null,
    materialId: row.materialId,
  };
}
