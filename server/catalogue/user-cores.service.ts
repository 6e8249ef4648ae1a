import { coreShapeSchema, IEC60205_SOURCE_NOTE } from '@shared/catalogue/core-schema';
import { ringCoreShape } from '@shared/catalogue/ring-core';
import type { CoreShape } from '@shared/engine/types';
import type { UserCoreRequest } from '@shared/schemas/cores';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import { badRequest, conflict, notFound } from '../http/errors.ts';
import { fieldErrorsFromZod } from '../http/errors.ts';
import { lineageSlug } from '../materials/materials.service.ts';
import type { CatalogueService } from './catalogue.service.ts';
import type { UserCoreWithAuthor, UserCoresRepository } from './user-cores.repository.ts';

export type CoreOrigin = 'shipped' | 'user';

function listed(shape: CoreShape, origin: CoreOrigin, row?: UserCoreWithAuthor) {
  return {
    ...shape,
    areaProduct: shape.ae * shape.windowArea,
    origin,
    ...(row
      ? { userCoreId: row.id, version: row.version, retired: row.retired, createdBy: row.createdByName, createdAt: row.createdAt.toISOString() }
      : {}),
  };
}

/** The engine's CoreShape from a request, checked with the shared core schema. */
export function shapeFromRequest(request: UserCoreRequest): CoreShape {
  const shape: CoreShape =
    request.kind === 'ring'
      ? ringCoreShape({
          id: request.name,
          family: request.family,
          dimensions: { outerDiameter: request.outerDiameter, innerDiameter: request.innerDiameter, height: request.height },
          source: [IEC60205_SOURCE_NOTE, request.source].filter(Boolean).join('; '),
        })
      : {
          id: request.name,
          family: request.family,
          gapKind: 'air-gap',
          ae: request.ae,
          ...(request.amin !== undefined ? { amin: request.amin } : {}),
          le: request.le,
          ve: request.ve,
          windowArea: request.windowArea,
          windowHeight: request.windowHeight,
          bobbinWidth: request.bobbinWidth,
          bobbinHeight: request.bobbinHeight,
          mlt: request.mlt,
          surfaceArea: request.surfaceArea,
          source: request.source,
        };
  const checked = coreShapeSchema.safeParse(shape);
  if (!checked.success) {
    const fields = fieldErrorsFromZod(checked.error);
    throw badRequest(`The core is not consistent: ${Object.entries(fields).map(([k, v]) => `${k}: ${v}`).slice(0, 3).join('; ')}`, fields);
  }
  return shape;
}

/** Shipped cores plus the cores users added (versioned like materials). */
export class UserCoresService {
  constructor(
    private readonly repo: UserCoresRepository,
    private readonly catalogue: CatalogueService,
    private readonly audit: AuditService,
  ) {
    // Searches read the catalogue synchronously, so the stored user cores are handed over once at start-up;
    // a database that is not up yet only delays them until the next change.
    this.refresh().catch(() => undefined);
  }

  /** Hand the current user cores to the catalogue, so searches and evaluations see them. */
  async refresh(): Promise<void> {
    this.catalogue.setUserCores((await this.repo.listCurrent(false)).map((r) => r.shape as CoreShape));
  }

  async list() {
    const shipped = this.catalogue.shippedCores().map((c) => listed(c, 'shipped'));
    const user = (await this.repo.listCurrent()).map((row) => listed(row.shape as CoreShape, 'user', row));
    return [...shipped, ...user];
  }

  /** A core by id for calculations: shipped first, then current user cores that are not retired. */
  async core(id: string): Promise<CoreShape> {
    const shipped = this.catalogue.shippedCores().find((c) => c.id === id);
    if (shipped) return shipped;
    const user = (await this.repo.listCurrent(false)).find((r) => (r.shape as CoreShape).id === id);
    if (!user) throw badRequest(`No core "${id}" in the catalogue.`, { coreId: `Unknown core "${id}"` });
    return user.shape as CoreShape;
  }

  async history(id: number) {
    const row = await this.repo.findById(id);
    if (!row) throw notFound(`No user core with id ${id}.`);
    return (await this.repo.history(row.lineage)).map((r) => listed(r.shape as CoreShape, 'user', r));
  }

  private async assertNameFree(name: string, exceptLineage?: string) {
    const lower = name.toLowerCase();
    if (this.catalogue.shippedCores().some((c) => c.id.toLowerCase() === lower)) {
      throw conflict(`"${name}" is a shipped core; choose another name.`, { name: 'Name of a shipped core' });
    }
    const clash = (await this.repo.listCurrent()).find((r) => r.name.toLowerCase() === lower && r.lineage !== exceptLineage);
    if (clash) throw conflict(`A user core is already called "${name}".`, { name: 'Name already used' });
  }

  async create(request: UserCoreRequest, actor: Actor) {
    const shape = shapeFromRequest(request);
    await this.assertNameFree(request.name);
    const lineage = `${lineageSlug(request.name)}-${Date.now().toString(36)}`;
    const row = await this.repo.addVersion({ lineage, version: 1, name: request.name, family: shape.family, shape, createdBy: actor.id, retired: false });
    await this.refresh();
    await this.audit.record({ actorId: actor.id, action: 'core.added', target: request.name, details: { id: row.id } });
    return listed(shape, 'user', { ...row, createdByName: actor.displayName });
  }

  async edit(id: number, request: UserCoreRequest, actor: Actor) {
    const previous = await this.repo.findById(id);
    if (!previous) throw notFound(`No user core with id ${id}.`);
    if (!previous.current) throw conflict('Only the current version of a core can be edited.', { id: 'Not the current version' });
    const shape = shapeFromRequest(request);
    await this.assertNameFree(request.name, previous.lineage);
    const row = await this.repo.addVersion(
      { lineage: previous.lineage, version: previous.version + 1, name: request.name, family: shape.family, shape, createdBy: actor.id, retired: previous.retired },
      previous.id,
    );
    await this.refresh();
    await this.audit.record({ actorId: actor.id, action: 'core.edited', target: request.name, details: { id: row.id, version: row.version } });
    return listed(shape, 'user', { ...row, createdByName: actor.displayName });
  }

  async setRetired(id: number, retired: boolean, actor: Actor) {
    const row = await this.repo.setRetired(id, retired);
    if (!row) throw notFound(`No current user core with id ${id}.`);
    await this.refresh();
    await this.audit.record({ actorId: actor.id, action: retired ? 'core.retired' : 'core.unretired', target: row.name, details: { id } });
    return listed(row.shape as CoreShape, 'user', { ...row, createdByName: null });
  }
}
