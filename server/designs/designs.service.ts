import type { DesignDetail, DesignListQuery, DesignListResponse, DesignSpec, RevisionDetail, RevisionDiff } from '@shared/schemas/designs';
import { readConstruction, readStoredResult } from '@shared/schemas/designs';
import type { Actor } from '../http/access.ts';
import { notFound } from '../http/errors.ts';
import { GenerationMemo } from '../http/generation-cache.ts';
import { diffObjects } from './flatten.ts';
import type { Caller } from './revision-access.ts';
import { converterSummary, designDetail, revisionDetail } from './revision-views.ts';
import type { DesignWithOwner, DesignsRepository } from './designs.repository.ts';

/** Reading designs: the list, one design, one revision, the differences between two revisions. */
export class DesignsService {
  constructor(private readonly repo: DesignsRepository) {}

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
    return designDetail(actor, design, revisions);
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

  /** Results that no longer read (saved by an older version) compare as none. */
  async diff(id: number, from: number, to: number): Promise<RevisionDiff> {
    const design = await this.mustFind(id);
    const [a, b] = await Promise.all([this.repo.revision(id, from), this.repo.revision(id, to)]);
    if (!a) throw notFound(`Design ${design.number} has no revision ${from}.`);
    if (!b) throw notFound(`Design ${design.number} has no revision ${to}.`);
    const evaluation = (stored: unknown) => readStoredResult(stored).result?.evaluation;
    return {
      from,
      to,
      spec: diffObjects(a.spec, b.spec),
      construction: diffObjects(readConstruction(a.construction), readConstruction(b.construction)),
      result: diffObjects(evaluation(a.result), evaluation(b.result)).filter((d) => !d.path.startsWith('issues')),
    };
  }

  async mustFind(id: number): Promise<DesignWithOwner> {
    const design = await this.repo.findDesign(id);
    if (!design) throw notFound(`No design with id ${id}.`);
    return design;
  }
}
